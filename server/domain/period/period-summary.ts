import { METHOD_DETECTION_LIMIT, MINIMUM_LEVEL } from '../method-1664.js';
import { dailyDischarges, type DailyDischarge } from './daily-discharges.js';
import { toLimitUnit, type FlowOn, type ToLimitUnit } from './limit-units.js';
import { monitoringChecker, type MonitoringCheck } from './monitoring.js';
import { precisionRule, shownFigure } from './shown-precision.js';
import { sncVerdict, sncWindows } from './significant-noncompliance.js';
import { dailyMaximum, dayThatTookAverageOver, exceeds, fallsBelow, monthlyAverages, type DayFigure } from './statistics.js';
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
  monitoring: (limit: LimitInput, span: Span, discharges: DailyDischarge[]) => MonitoringCheck;
  scaleFor: (limit: LimitInput) => ToLimitUnit;
  /** A point's daily discharges of a parameter over a span, shared by its limits (a daily maximum and a monthly average, say). */
  dischargesOf: (limit: LimitInput, span: Span, measurements: Measurement[]) => DailyDischarge[];
}

/** Days from `start` through `end`, inclusive. */
interface Span {
  start: string;
  end: string;
}

/** The days of the period a limit version judged, or null when it was not in force during the period. */
export function versionSpan(limit: Pick<LimitInput, 'appliesFrom' | 'appliesTo'>, period: Span): Span | null {
  const start = limit.appliesFrom > period.start ? limit.appliesFrom : period.start;
  const end = limit.appliesTo !== null && limit.appliesTo < period.end ? limit.appliesTo : period.end;
  return start <= end ? { start, end } : null;
}

/**
 * EPA Method 1664 §12.3.1: a result below the minimum level of quantitation is reported as
 * "<ML" (<5.0 mg/L), not as its measured number; the summary counts it as it is reported, a
 * non-detect at the ML. The lab's own ML applies where it reported one.
 */
export function asReported(measurement: Measurement): Measurement {
  if (measurement.qualifier !== null) return measurement;
  const ml = measurement.ml ?? MINIMUM_LEVEL;
  return measurement.value < ml ? { ...measurement, qualifier: '<', ml } : measurement;
}

function limitRow(limit: LimitInput, span: Span, context: Context): LimitRow {
  const { permit } = context.input;
  const inPeriod = context.inPeriod.get(limit.dischargePointId, limit.parameterId).filter((m) => m.day >= span.start && m.day <= span.end);
  const scale = context.scaleFor(limit);
  const rule = precisionRule(limit);
  const shown = (value: Figure | null) => shownFigure(value, rule);
  const exceedance = (date: string, value: number, measurements: Measurement[], madeAwareBy = measurements): Exceedance => ({
    date,
    value,
    shownValue: shown(value)!,
    limit: limit.value,
    percentOver: percentPast(value, limit.value, limit.statistic === 'instantaneous-minimum'),
    ...evidence(measurements),
    awareCertificateIds: [...new Set(madeAwareBy.map((m) => m.certificateId))],
  });

  const discharges = context.dischargesOf(limit, span, inPeriod);
  const days: LimitDay[] = [];
  const daysWithoutFlow: string[] = [];
  for (const discharge of discharges) {
    const value = scale(discharge.value, discharge.day);
    if (value === null) daysWithoutFlow.push(discharge.day);
    else days.push({ day: discharge.day, value, allNonDetect: discharge.allNonDetect, source: discharge });
  }
  const monitoring = context.monitoring(limit, span, discharges);
  let computedValue: Figure | null = null;
  let monthlyValues: LimitRow['monthlyValues'] = [];
  let exceedances: Exceedance[] = [];
  const grabsOverOnCompliantDays: LimitRow['grabsOverOnCompliantDays'] = [];

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
      } else {
        // Judged on the day's average, one grab may be over while the day is within: said so, as
        // the certificate flags that grab and would otherwise seem to disagree.
        for (const day of days) {
          if (day.value > limit.value) continue;
          const grabs = day.source.measurements.filter((m) => m.qualifier === null).map((m) => scale(m.value, m.day) ?? -Infinity);
          const highest = Math.max(...grabs);
          if (highest > limit.value) grabsOverOnCompliantDays.push({ day: day.day, grabValue: highest, dayValue: day.value });
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
        .map((month) => {
          const monthDays = days.filter((day) => day.day.startsWith(month.month));
          const tipping = dayThatTookAverageOver(monthDays, limit.value);
          const all = monthDays.flatMap((day) => day.source.measurements);
          return exceedance(
            month.month,
            month.value as number,
            all,
            monthDays.find((day) => day.day === tipping)?.source.measurements ?? all,
          );
        });
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
    appliesFrom: span.start,
    appliesTo: span.end,
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
    inputsWithFindings: inPeriod.filter((m) => m.hasFinding).map((m) => m.resultId),
    grabsOverOnCompliantDays,
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
  const dischargesOf = (limit: LimitInput, span: Span, measurements: Measurement[]) => {
    const key = `${limit.dischargePointId}|${limit.parameterId}|${span.start}|${span.end}`;
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
  const checkers = new Map<string, ReturnType<typeof monitoringChecker>>();
  const checks = new Map<string, MonitoringCheck>();
  const bySamplingDay = input.permit.monitoringCounts === 'sampling-days';
  const monitoring = (limit: LimitInput, span: Span, discharges: DailyDischarge[]) => {
    const spanKey = `${span.start}|${span.end}`;
    const key = `${limit.dischargePointId}|${limit.parameterId}|${limit.frequencyCount}|${limit.frequencyPer}|${spanKey}`;
    let check = checks.get(key);
    if (!check) {
      let checker = checkers.get(spanKey);
      if (!checker) checkers.set(spanKey, (checker = monitoringChecker({ ...span, asOf: input.period.asOf })));
      check = checker(
        limit,
        discharges.map((d) => ({ day: d.day, samples: bySamplingDay ? 1 : d.measurements.length })),
      );
      checks.set(key, check);
    }
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
export function compilePeriod(given: PeriodInput): PeriodSummaryCore {
  const method1664 = new Set(given.limits.filter((l) => l.method1664).map((l) => l.parameterId));
  const input = { ...given, measurements: given.measurements.map((m) => (method1664.has(m.parameterId) ? asReported(m) : m)) };
  const context = contextOf(input);
  // One row per limit version in force during the period: a period straddling a change shows both.
  const rows = input.limits.flatMap((limit) => {
    const span = versionSpan(limit, input.period);
    return span ? [limitRow(limit, span, context)] : [];
  });
  return {
    nonDetectPolicy: input.permit.nonDetectPolicy,
    massLoadingFactor: input.permit.massLoadingFactor,
    rows,
    significantNoncompliance: significantNoncompliance(input, context),
  };
}
