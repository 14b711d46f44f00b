import { dailyDischarges, type DailyDischarge } from './daily-discharges.js';
import { monitoringCheck } from './monitoring.js';
import { sncVerdict, sncWindows } from './significant-noncompliance.js';
import { dailyMaximum, exceeds, fallsBelow, monthlyAverages } from './statistics.js';
import type { Exceedance, LimitRow, PeriodSummaryCore } from '../../contracts/periods.js';
import type { Figure, LimitInput, Measurement, PeriodInput } from './types.js';

export type { Exceedance, LimitRow, PeriodSummaryCore };

const percentOver = (value: number, limit: number) => (limit === 0 ? 0 : Math.round(((value - limit) / limit) * 1000) / 10);
const figure = (day: DailyDischarge): Figure => (day.allNonDetect ? '<ML' : day.value);
const evidence = (measurements: Measurement[]) => ({
  resultIds: measurements.map((m) => m.resultId),
  certificateIds: [...new Set(measurements.map((m) => m.certificateId))],
});

type Index = Map<string, Measurement[]>;
const pairKey = (pointId: string, parameterId: string) => `${pointId}|${parameterId}`;

/** The period's measurements grouped by point and parameter, once, instead of a scan per limit. */
function indexMeasurements(input: PeriodInput): Index {
  const index: Index = new Map();
  for (const m of input.measurements) {
    if (m.day < input.period.start || m.day > input.period.end) continue;
    const key = pairKey(m.dischargePointId, m.parameterId);
    const list = index.get(key);
    if (list) list.push(m);
    else index.set(key, [m]);
  }
  return index;
}

function limitRow(limit: LimitInput, input: PeriodInput, index: Index): LimitRow {
  const { permit, period } = input;
  const inPeriod = index.get(pairKey(limit.dischargePointId, limit.parameterId)) ?? [];
  const flows = input.flows.filter((f) => f.dischargePointId === limit.dischargePointId);
  const days = dailyDischarges(inPeriod, permit.nonDetectPolicy, flows, permit.massLoadingFactor);
  const monitoring = monitoringCheck(limit, inPeriod, period);
  const detected = inPeriod.filter((m) => m.qualifier === null);
  let computedValue: Figure | null = null;
  let monthlyValues: LimitRow['monthlyValues'] = [];
  let exceedances: Exceedance[] = [];

  switch (limit.statistic) {
    case 'daily-maximum': {
      computedValue = dailyMaximum(days);
      exceedances = days
        .filter((day) => !day.allNonDetect && day.value > limit.value)
        .map((day) => ({ date: day.day, value: day.value, limit: limit.value, percentOver: percentOver(day.value, limit.value), ...evidence(day.measurements) }));
      if (permit.dailyMaxAppliesToEachGrab) {
        // Some authorities apply the daily maximum to every single grab as well (a permit setting).
        for (const m of detected.filter((m) => m.value > limit.value && !exceedances.some((e) => e.date === m.day))) {
          exceedances.push({ date: m.day, value: m.value, limit: limit.value, percentOver: percentOver(m.value, limit.value), ...evidence([m]) });
        }
      }
      break;
    }
    case 'monthly-average': {
      monthlyValues = monthlyAverages(days).map((month) => ({ ...month, exceeded: exceeds(month.value, limit.value) }));
      const numeric = monthlyValues.filter((month) => typeof month.value === 'number');
      computedValue = monthlyValues.length === 0 ? null : numeric.length === 0 ? '<ML' : Math.max(...numeric.map((m) => m.value as number));
      exceedances = monthlyValues
        .filter((month) => month.exceeded)
        .map((month) => ({
          date: month.month,
          value: month.value as number,
          limit: limit.value,
          percentOver: percentOver(month.value as number, limit.value),
          ...evidence(days.filter((day) => day.day.startsWith(month.month)).flatMap((day) => day.measurements)),
        }));
      break;
    }
    case 'instantaneous-maximum':
    case 'instantaneous-minimum': {
      const isMax = limit.statistic === 'instantaneous-maximum';
      computedValue = inPeriod.length === 0 ? null : detected.length === 0 ? '<ML' : (isMax ? Math.max : Math.min)(...detected.map((m) => m.value));
      exceedances = detected
        .filter((m) => (isMax ? m.value > limit.value : m.value < limit.value))
        .map((m) => ({ date: m.day, value: m.value, limit: limit.value, percentOver: percentOver(m.value, limit.value), ...evidence([m]) }));
      break;
    }
  }

  const exceeded =
    limit.statistic === 'instantaneous-minimum' ? fallsBelow(computedValue, limit.value) : exceedances.length > 0 || exceeds(computedValue, limit.value);
  return {
    limitId: limit.id,
    dischargePointId: limit.dischargePointId,
    pointCode: limit.pointCode,
    parameterId: limit.parameterId,
    parameter: limit.parameterName,
    statistic: limit.statistic,
    unit: limit.unit,
    limitValue: limit.value,
    computedValue,
    exceeded,
    samplesTaken: monitoring.taken,
    samplesRequired: monitoring.required,
    missedMonitoring: monitoring.missed,
    dailyValues: days.map((day) => ({ day: day.day, value: figure(day), massLoading: day.massLoading })),
    monthlyValues,
    exceedances,
  };
}

/**
 * Compiles a reporting period against every limit of the permit. Pure: the same input gives
 * the same summary, so recompiling is safe and testable without a database.
 */
export function compilePeriod(input: PeriodInput): PeriodSummaryCore {
  const index = indexMeasurements(input);
  const rows = input.limits.map((limit) => limitRow(limit, input, index));
  let significantNoncompliance: PeriodSummaryCore['significantNoncompliance'] = null;
  if (input.permit.kind === 'pretreatment') {
    const limitsByPoint = new Map<string, LimitInput[]>();
    for (const limit of input.limits) limitsByPoint.set(limit.dischargePointId, [...(limitsByPoint.get(limit.dischargePointId) ?? []), limit]);
    const parameters = new Map(input.limits.filter((l) => l.isPollutant).map((l) => [l.parameterId, { id: l.parameterId, name: l.parameterName, reviewFactor: l.sncReviewFactor }]));
    significantNoncompliance = sncWindows(input.period, input.permit.sncWindow).flatMap((window) =>
      [...parameters.values()].map((parameter) => sncVerdict(parameter, window, input.measurements, limitsByPoint)),
    );
  }
  return { nonDetectPolicy: input.permit.nonDetectPolicy, massLoadingFactor: input.permit.massLoadingFactor, rows, significantNoncompliance };
}
