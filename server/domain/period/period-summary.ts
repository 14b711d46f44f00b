import { METHOD_DETECTION_LIMIT } from '../method-1664.js';
import { dailyDischarges, type DailyDischarge } from './daily-discharges.js';
import { toLimitUnit, type FlowOn, type ToLimitUnit } from './limit-units.js';
import { monitoringChecker, type MonitoringCheck } from './monitoring.js';
import { precisionRule, shownFigure } from './shown-precision.js';
import { sncVerdict, sncWindows } from './significant-noncompliance.js';
import { dailyMaximum, exceeds, fallsBelow, monthlyAverages, type DayFigure } from './statistics.js';
import type { Exceedance, LimitRow, PeriodSummaryCore } from '../../contracts/periods.js';
import type { Figure, LimitInput, Measurement, PeriodInput } from './types.js';

export type { Exceedance, LimitRow, PeriodSummaryCore };

/** How far past the limit, in % of it, to one decimal: above a maximum, or below a minimum. */
const percentPast = (value: number, limit: number, isMinimum: boolean) =>
  limit === 0 ? 0 : Math.round(((isMinimum ? limit - value : value - limit) / limit) * 1000) / 10;
const evidence = (measurements: Measurement[]) => ({
  resultIds: measurements.map((m) => m.resultId),
  certificateIds: [...new Set(measurements.map((m) => m.certificateId))],
});

/** Lists kept per discharge point, then per parameter: built once, read once per limit. */
class ByPointAndParameter<T extends { dischargePointId: string; parameterId: string }> {
  private readonly points = new Map<string, Map<string, T[]>>();
  add(item: T): void {
    let parameters = this.points.get(item.dischargePointId);
    if (!parameters) this.points.set(item.dischargePointId, (parameters = new Map()));
    const list = parameters.get(item.parameterId);
    if (list) list.push(item);
    else parameters.set(item.parameterId, [item]);
  }
  get(pointId: string, parameterId: string): T[] {
    return this.points.get(pointId)?.get(parameterId) ?? [];
  }
}

/** A daily discharge in the limit's unit (a loading for a mass limit). */
interface LimitDay extends DayFigure {
  source: DailyDischarge;
}

interface Context {
  input: PeriodInput;
  inPeriod: ByPointAndParameter<Measurement>;
  flowOn: FlowOn;
  monitoring: (limit: LimitInput, discharges: DailyDischarge[]) => MonitoringCheck;
  scaleFor: (limit: LimitInput) => ToLimitUnit;
  /** A point's daily discharges of a parameter, shared by its limits (a daily maximum and a monthly average, say). */
  dischargesOf: (limit: LimitInput, measurements: Measurement[]) => DailyDischarge[];
}

function limitRow(limit: LimitInput, context: Context): LimitRow {
  const { permit } = context.input;
  const inPeriod = context.inPeriod.get(limit.dischargePointId, limit.parameterId);
  const scale = context.scaleFor(limit);
  const rule = precisionRule(limit);
  const shown = (value: Figure | null) => shownFigure(value, rule);
  const exceedance = (date: string, value: number, measurements: Measurement[]): Exceedance => ({
    date,
    value,
    shownValue: shown(value)!,
    limit: limit.value,
    percentOver: percentPast(value, limit.value, limit.statistic === 'instantaneous-minimum'),
    ...evidence(measurements),
  });

  const discharges = context.dischargesOf(limit, inPeriod);
  const days: LimitDay[] = [];
  const daysWithoutFlow: string[] = [];
  for (const discharge of discharges) {
    const value = scale(discharge.value, discharge.day);
    if (value === null) daysWithoutFlow.push(discharge.day);
    else days.push({ day: discharge.day, value, allNonDetect: discharge.allNonDetect, source: discharge });
  }
  const monitoring = context.monitoring(limit, discharges);
  let computedValue: Figure | null = null;
  let monthlyValues: LimitRow['monthlyValues'] = [];
  let exceedances: Exceedance[] = [];

  switch (limit.statistic) {
    case 'daily-maximum': {
      computedValue = dailyMaximum(days);
      exceedances = days
        .filter((day) => !day.allNonDetect && day.value > limit.value)
        .map((day) => exceedance(day.day, day.value, day.source.measurements));
      if (permit.dailyMaxAppliesToEachGrab) {
        // Some authorities apply the daily maximum to every single grab as well (a permit setting).
        const daysOver = new Set(exceedances.map((e) => e.date));
        for (const m of inPeriod) {
          if (m.qualifier === '<' || daysOver.has(m.day)) continue;
          const value = scale(m.value, m.day);
          if (value !== null && value > limit.value) exceedances.push(exceedance(m.day, value, [m]));
        }
      }
      break;
    }
    case 'monthly-average': {
      monthlyValues = monthlyAverages(days).map((month) => ({
        ...month,
        shownValue: shown(month.value)!,
        exceeded: exceeds(month.value, limit.value),
      }));
      const numeric = monthlyValues.map((month) => month.value).filter((value): value is number => typeof value === 'number');
      computedValue = monthlyValues.length === 0 ? null : numeric.length === 0 ? '<ML' : Math.max(...numeric);
      exceedances = monthlyValues
        .filter((month) => month.exceeded)
        .map((month) =>
          exceedance(
            month.month,
            month.value as number,
            days.filter((day) => day.day.startsWith(month.month)).flatMap((day) => day.source.measurements),
          ),
        );
      break;
    }
    case 'instantaneous-maximum':
    case 'instantaneous-minimum': {
      const isMax = limit.statistic === 'instantaneous-maximum';
      const detected = inPeriod.flatMap((m) => {
        const value = m.qualifier === null ? scale(m.value, m.day) : null;
        return value === null ? [] : [{ m, value }];
      });
      computedValue =
        inPeriod.length === 0 ? null : detected.length === 0 ? '<ML' : (isMax ? Math.max : Math.min)(...detected.map((d) => d.value));
      exceedances = detected
        .filter(({ value }) => (isMax ? value > limit.value : value < limit.value))
        .map(({ m, value }) => exceedance(m.day, value, [m]));
      break;
    }
  }

  const exceeded =
    limit.statistic === 'instantaneous-minimum'
      ? fallsBelow(computedValue, limit.value)
      : exceedances.length > 0 || exceeds(computedValue, limit.value);
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
    shownValue: shown(computedValue),
    precision: rule.source,
    exceeded,
    samplesTaken: monitoring.taken,
    samplesRequired: monitoring.required,
    missedMonitoring: monitoring.missed,
    daysWithoutFlow,
    dailyValues: days.map((day) => ({ day: day.day, value: day.allNonDetect ? '<ML' : day.value, massLoading: day.source.massLoading })),
    monthlyValues,
    exceedances,
  };
}

function contextOf(input: PeriodInput): Context {
  const inPeriod = new ByPointAndParameter<Measurement>();
  for (const m of input.measurements) if (m.day >= input.period.start && m.day <= input.period.end) inPeriod.add(m);
  const flows = new Map<string, Map<string, number>>();
  for (const reading of input.flows) {
    let days = flows.get(reading.dischargePointId);
    if (!days) flows.set(reading.dischargePointId, (days = new Map()));
    days.set(reading.day, reading.mgd);
  }
  const flowOn: FlowOn = (pointId, day) => flows.get(pointId)?.get(day);
  const scales = new Map<string, ToLimitUnit>();
  const scaleFor = (limit: LimitInput) => {
    let scale = scales.get(limit.id);
    if (!scale) scales.set(limit.id, (scale = toLimitUnit(limit, flowOn, input.permit.massLoadingFactor)));
    return scale;
  };
  const discharges = new Map<string, DailyDischarge[]>();
  const dischargesOf = (limit: LimitInput, measurements: Measurement[]) => {
    const key = `${limit.dischargePointId}|${limit.parameterId}`;
    let days = discharges.get(key);
    if (!days) {
      const flowOnDay = (day: string) => flowOn(limit.dischargePointId, day);
      const methodMdl = limit.method1664 ? METHOD_DETECTION_LIMIT : null;
      discharges.set(
        key,
        (days = dailyDischarges(measurements, input.permit.nonDetectPolicy, flowOnDay, input.permit.massLoadingFactor, methodMdl)),
      );
    }
    return days;
  };
  const checkMonitoring = monitoringChecker(input.period);
  const checks = new Map<string, MonitoringCheck>();
  const monitoring = (limit: LimitInput, discharges: DailyDischarge[]) => {
    const key = `${limit.dischargePointId}|${limit.parameterId}|${limit.frequencyCount}|${limit.frequencyPer}`;
    let check = checks.get(key);
    if (!check)
      checks.set(
        key,
        (check = checkMonitoring(
          limit,
          discharges.map((d) => ({ day: d.day, samples: d.measurements.length })),
        )),
      );
    return check;
  };
  return { input, inPeriod, flowOn, monitoring, scaleFor, dischargesOf };
}

/** 40 CFR 403.8(f)(2)(viii) verdicts per pollutant and six-month window; null for a direct-discharge permit. */
function significantNoncompliance(input: PeriodInput, context: Context): PeriodSummaryCore['significantNoncompliance'] {
  if (input.permit.kind !== 'pretreatment') return null;
  const limitsByPoint = new Map<string, LimitInput[]>();
  for (const limit of input.limits) {
    const list = limitsByPoint.get(limit.dischargePointId);
    if (list) list.push(limit);
    else limitsByPoint.set(limit.dischargePointId, [limit]);
  }
  const byParameter = new Map<string, Measurement[]>();
  for (const m of input.measurements) {
    const list = byParameter.get(m.parameterId);
    if (list) list.push(m);
    else byParameter.set(m.parameterId, [m]);
  }
  const parameters = new Map(
    input.limits
      .filter((l) => l.isPollutant)
      .map((l) => [l.parameterId, { id: l.parameterId, name: l.parameterName, reviewFactor: l.sncReviewFactor }]),
  );
  return sncWindows(input.period, input.permit.sncWindow).flatMap((window) =>
    [...parameters.values()].map((parameter) =>
      sncVerdict(parameter, window, byParameter.get(parameter.id) ?? [], limitsByPoint, context.scaleFor),
    ),
  );
}

/**
 * Compiles a reporting period against every limit of the permit. Pure: the same input gives
 * the same summary, so recompiling is safe and testable without a database.
 */
export function compilePeriod(input: PeriodInput): PeriodSummaryCore {
  const context = contextOf(input);
  return {
    nonDetectPolicy: input.permit.nonDetectPolicy,
    massLoadingFactor: input.permit.massLoadingFactor,
    rows: input.limits.map((limit) => limitRow(limit, context)),
    significantNoncompliance: significantNoncompliance(input, context),
  };
}
