import type { FlowReading, Figure, Measurement, NonDetectPolicy } from './types.js';

/**
 * The number a non-detect stands for in an average, as the permit says (a permit setting;
 * the summary states which). Without a reported MDL/ML, Method 1664's 1.4 / 5.0 mg/L apply.
 */
export function nonDetectValue(measurement: Measurement, policy: NonDetectPolicy): number {
  const mdl = measurement.mdl ?? 1.4;
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
  /** Numeric value used in statistics (non-detects substituted per policy). */
  value: number;
  /** True when every measurement of the day was a non-detect. */
  allNonDetect: boolean;
  measurements: Measurement[];
  /** lb/day = MGD × mg/L × factor and kg/day = m³/day × mg/L / 1000, where the day has a flow. */
  massLoading: { lbPerDay: number; kgPerDay: number } | null;
}

const M3_PER_MILLION_GALLONS = 3785.411784;

/**
 * 40 CFR 122.2, "daily discharge": for a concentration, the average of the measurements taken
 * during the calendar day (the site's local day).
 */
export function dailyDischarges(measurements: Measurement[], policy: NonDetectPolicy, flows: FlowReading[], factor: number): DailyDischarge[] {
  const byDay = new Map<string, Measurement[]>();
  for (const measurement of measurements) {
    const list = byDay.get(measurement.day) ?? [];
    list.push(measurement);
    byDay.set(measurement.day, list);
  }
  const flowByDay = new Map(flows.map((reading) => [`${reading.dischargePointId}|${reading.day}`, reading]));
  return [...byDay.entries()]
    .sort(([a], [b]) => a.localeCompare(b))
    .map(([day, list]) => {
      const values = list.map((m) => (m.qualifier === '<' ? nonDetectValue(m, policy) : m.value));
      const value = values.reduce((sum, v) => sum + v, 0) / values.length;
      const flow = flowByDay.get(`${list[0]!.dischargePointId}|${day}`);
      return {
        day,
        value,
        allNonDetect: list.every((m) => m.qualifier === '<'),
        measurements: list,
        massLoading: flow ? { lbPerDay: flow.mgd * value * factor, kgPerDay: (flow.mgd * M3_PER_MILLION_GALLONS * value) / 1000 } : null,
      };
    });
}

/** A statistic over daily discharges, or "<ML" when all of them were non-detects. */
export function figureOf(days: DailyDischarge[], pick: (values: number[]) => number): Figure | null {
  if (days.length === 0) return null;
  if (days.every((day) => day.allNonDetect)) return '<ML';
  return pick(days.map((day) => day.value));
}
