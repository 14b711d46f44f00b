import { DateTime } from 'luxon';
import type { LimitInput, Measurement } from './types.js';

export interface MonitoringCheck {
  taken: number;
  required: number;
  /** Each calendar unit (day, ISO week, month, quarter) with fewer samples than the permit asks. */
  missed: Array<{ unit: string; taken: number; required: number }>;
}

const unitKey = (day: string, per: LimitInput['frequencyPer']) => {
  const date = DateTime.fromISO(day, { zone: 'UTC' });
  switch (per) {
    case 'day':
      return day;
    case 'week':
      return `${date.weekYear}-W${String(date.weekNumber).padStart(2, '0')}`;
    case 'month':
      return day.slice(0, 7);
    case 'quarter':
      return `${date.year}-Q${date.quarter}`;
  }
};

/**
 * Samples taken against samples required by the monitoring frequency ("n per day / week /
 * month / quarter"), counted per calendar unit inside the period. A partial week at a period
 * edge is counted as a whole one (common practice, no published source; a permit may differ).
 */
export function monitoringCheck(limit: LimitInput, measurements: Measurement[], period: { start: string; end: string }): MonitoringCheck {
  const units = new Map<string, number>();
  for (let day = DateTime.fromISO(period.start, { zone: 'UTC' }); day.toISODate()! <= period.end; day = day.plus({ days: 1 })) {
    units.set(unitKey(day.toISODate()!, limit.frequencyPer), 0);
  }
  // One sample a collection: several results of one sample count once.
  const samples = new Set(measurements.map((m) => `${m.day}|${m.resultId}`));
  for (const key of samples) {
    const unit = unitKey(key.split('|')[0]!, limit.frequencyPer);
    if (units.has(unit)) units.set(unit, units.get(unit)! + 1);
  }
  const missed = [...units.entries()]
    .filter(([, taken]) => taken < limit.frequencyCount)
    .map(([unit, taken]) => ({ unit, taken, required: limit.frequencyCount }));
  return { taken: samples.size, required: units.size * limit.frequencyCount, missed };
}
