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

function unitLength(key: string, per: LimitInput['frequencyPer']): number {
  switch (per) {
    case 'day':
      return 1;
    case 'week':
      return 7;
    case 'month':
      return DateTime.fromISO(`${key}-01`, { zone: 'UTC' }).daysInMonth!;
    case 'quarter': {
      const [year, quarter] = key.split('-Q').map(Number);
      const start = DateTime.fromObject({ year: year!, month: (quarter! - 1) * 3 + 1, day: 1 }, { zone: 'UTC' });
      return start.plus({ months: 3 }).diff(start, 'days').days;
    }
  }
}

/**
 * Samples taken against samples required by the monitoring frequency ("n per day / week /
 * month / quarter"), counted per calendar unit inside the period.
 */
/** The period's days with their week, month and quarter keys; computed once per period, not per limit. */
const calendars = new Map<string, Array<Record<LimitInput['frequencyPer'], string>>>();
function calendarOf(period: { start: string; end: string }) {
  const key = `${period.start}|${period.end}`;
  let calendar = calendars.get(key);
  if (!calendar) {
    calendar = [];
    for (let day = DateTime.fromISO(period.start, { zone: 'UTC' }); day.toISODate()! <= period.end; day = day.plus({ days: 1 })) {
      const iso = day.toISODate()!;
      calendar.push({ day: iso, week: unitKey(iso, 'week'), month: unitKey(iso, 'month'), quarter: unitKey(iso, 'quarter') });
    }
    if (calendars.size > 50) calendars.clear();
    calendars.set(key, calendar);
  }
  return calendar;
}

export function monitoringCheck(limit: LimitInput, measurements: Measurement[], period: { start: string; end: string; asOf?: string }): MonitoringCheck {
  const units = new Map<string, number>();
  const lastDayOf = new Map<string, string>();
  const daysIn = new Map<string, number>();
  const calendar = calendarOf(period);
  const unitOfDay = new Map<string, string>();
  for (const entry of calendar) {
    const key = entry[limit.frequencyPer];
    unitOfDay.set(entry.day, key);
    units.set(key, 0);
    lastDayOf.set(key, entry.day);
    daysIn.set(key, (daysIn.get(key) ?? 0) + 1);
  }
  // A week or month cut by the period's edge belongs to the neighbouring period's count as well:
  // only whole units are counted (common practice, no published source; a permit may differ).
  for (const [key, days] of daysIn) if (days < unitLength(key, limit.frequencyPer)) units.delete(key);
  // A week or month still running is not missed yet.
  if (period.asOf) for (const [key, last] of lastDayOf) if (last > period.asOf) units.delete(key);
  // One sample a collection: several results of one sample count once.
  const samples = new Set(measurements.map((m) => `${m.day}|${m.resultId}`));
  for (const key of samples) {
    const unit = unitOfDay.get(key.split('|')[0]!);
    if (unit !== undefined && units.has(unit)) units.set(unit, units.get(unit)! + 1);
  }
  const missed = [...units.entries()]
    .filter(([, taken]) => taken < limit.frequencyCount)
    .map(([unit, taken]) => ({ unit, taken, required: limit.frequencyCount }));
  return { taken: samples.size, required: units.size * limit.frequencyCount, missed };
}
