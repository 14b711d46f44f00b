import { massLoading } from './limit-units.js';
import type { Figure, Measurement, NonDetectPolicy } from './types.js';

/**
 * The number a non-detect stands for in an average, as the permit says (a permit setting;
 * the summary states which). Without a reported MDL the method's applies (1.4 mg/L for Method
 * 1664, `methodMdl`); without either, and without an ML, the reported "<" limit stands in
 * (common practice, no published source).
 */
export function nonDetectValue(measurement: Measurement, policy: NonDetectPolicy, methodMdl: number | null = null): number {
  const mdl = measurement.mdl ?? methodMdl ?? measurement.value;
  const ml = measurement.ml ?? measurement.value;
  switch (policy) {
    case 'zero':
      return 0;
    case 'mdl':
      return mdl;
    case 'ml':
      return ml;
    case 'half-mdl':
      return mdl / 2;
  }
}

export interface DailyDischarge {
  day: string;
  /** Numeric value used in statistics (non-detects substituted per policy), in the measured unit. */
  value: number;
  /** True when every measurement of the day was a non-detect. */
  allNonDetect: boolean;
  measurements: Measurement[];
  /** lb/day and kg/day, where the day has a flow reading. */
  massLoading: { lbPerDay: number; kgPerDay: number } | null;
}

/**
 * 40 CFR 122.2, "daily discharge": for a concentration, the average of the measurements taken
 * during the calendar day (the site's local day). Returned in day order.
 */
export function dailyDischarges(
  measurements: Measurement[],
  policy: NonDetectPolicy,
  flowOn: (day: string) => number | undefined,
  factor: number,
  methodMdl: number | null = null,
): DailyDischarge[] {
  // Results usually arrive in day order already: group runs of one day, sorting only when needed.
  const ordered = measurements.some((m, i) => i > 0 && m.day < measurements[i - 1]!.day)
    ? [...measurements].sort((a, b) => (a.day < b.day ? -1 : a.day > b.day ? 1 : 0))
    : measurements;
  const days: DailyDischarge[] = [];
  let start = 0;
  while (start < ordered.length) {
    const day = ordered[start]!.day;
    let end = start;
    let sum = 0;
    let allNonDetect = true;
    for (; end < ordered.length && ordered[end]!.day === day; end++) {
      const m = ordered[end]!;
      if (m.qualifier === '<') sum += nonDetectValue(m, policy, methodMdl);
      else {
        sum += m.value;
        allNonDetect = false;
      }
    }
    const value = sum / (end - start);
    const mgd = flowOn(day);
    days.push({
      day,
      value,
      allNonDetect,
      measurements: ordered.slice(start, end),
      massLoading: mgd === undefined ? null : massLoading(mgd, value, factor),
    });
    start = end;
  }
  return days;
}

/** A statistic over daily discharges, or "<ML" when all of them were non-detects. */
export function figureOf(days: Array<{ value: number; allNonDetect: boolean }>, pick: (values: number[]) => number): Figure | null {
  if (days.length === 0) return null;
  if (days.every((day) => day.allNonDetect)) return '<ML';
  return pick(days.map((day) => day.value));
}
