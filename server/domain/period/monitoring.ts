import { DateTime } from 'luxon';
import type { LimitInput } from './types.js';

export interface MonitoringCheck {
  taken: number;
  required: number;
  /** Each calendar unit (day, ISO week, month, quarter) with fewer samples than the permit asks. */
  missed: Array<{ unit: string; taken: number; required: number }>;
}

type Per = LimitInput['frequencyPer'];

const unitKey = (date: DateTime, per: Per): string => {
  switch (per) {
    case 'day':
      return date.toISODate()!;
    case 'week':
      return `${date.weekYear}-W${String(date.weekNumber).padStart(2, '0')}`;
    case 'month':
      return date.toISODate()!.slice(0, 7);
    case 'quarter':
      return `${date.year}-Q${date.quarter}`;
  }
};

/** The calendar units a period is counted in: each day's unit, and the units that count. */
interface UnitPlan {
  unitOfDay: Map<string, string>;
  counted: string[];
}

function unitPlan(period: { start: string; end: string; asOf?: string }, per: Per): UnitPlan {
  const unitOfDay = new Map<string, string>();
  const daysIn = new Map<string, number>();
  const lastDayOf = new Map<string, string>();
  const end = DateTime.fromISO(period.end, { zone: 'UTC' });
  for (let date = DateTime.fromISO(period.start, { zone: 'UTC' }); date <= end; date = date.plus({ days: 1 })) {
    const day = date.toISODate()!;
    const key = unitKey(date, per);
    unitOfDay.set(day, key);
    daysIn.set(key, (daysIn.get(key) ?? 0) + 1);
    lastDayOf.set(key, day);
  }
  const counted = [...daysIn.entries()]
    // A week or month cut by the period's edge belongs to the neighbouring period's count as well:
    // only whole units are counted (common practice, no published source; a permit may differ).
    .filter(([key, days]) => days === unitLength(key, per))
    // A week or month still running is not missed yet.
    .filter(([key]) => !period.asOf || lastDayOf.get(key)! <= period.asOf)
    .map(([key]) => key);
  return { unitOfDay, counted };
}

function unitLength(key: string, per: Per): number {
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

/** The calendar unit of a day: by slicing for day, month and quarter; from the plan for ISO weeks. */
function unitOfDay(day: string, per: Per, plan: UnitPlan): string | undefined {
  switch (per) {
    case 'day':
      return day;
    case 'month':
      return day.slice(0, 7);
    case 'quarter':
      return `${day.slice(0, 4)}-Q${Math.floor((Number(day.slice(5, 7)) - 1) / 3) + 1}`;
    case 'week':
      return plan.unitOfDay.get(day);
  }
}

/**
 * Samples taken against samples required by the monitoring frequency ("n per day / week /
 * month / quarter"), counted per calendar unit inside the period. The calendar is worked out
 * once per frequency and period, not once per limit. Takes the period's sampled days in day
 * order with how many samples each had.
 */
export function monitoringChecker(period: { start: string; end: string; asOf?: string }) {
  const plans = new Map<Per, UnitPlan>();
  return (limit: Pick<LimitInput, 'frequencyCount' | 'frequencyPer'>, days: Array<{ day: string; samples: number }>): MonitoringCheck => {
    let plan = plans.get(limit.frequencyPer);
    if (!plan) plans.set(limit.frequencyPer, (plan = unitPlan(period, limit.frequencyPer)));
    const counts = new Map(plan.counted.map((key) => [key, 0]));
    let taken = 0;
    // Days come in order, so a unit's days are together: add each run once.
    let unit: string | undefined;
    let inUnit = 0;
    const addRun = () => {
      const count = unit === undefined ? undefined : counts.get(unit);
      if (count !== undefined) counts.set(unit!, count + inUnit);
    };
    for (const { day, samples } of days) {
      taken += samples;
      const key = unitOfDay(day, limit.frequencyPer, plan);
      if (key !== unit) {
        addRun();
        unit = key;
        inUnit = 0;
      }
      inUnit += samples;
    }
    addRun();
    const missed = [...counts.entries()]
      .filter(([, count]) => count < limit.frequencyCount)
      .map(([key, count]) => ({ unit: key, taken: count, required: limit.frequencyCount }));
    return { taken, required: counts.size * limit.frequencyCount, missed };
  };
}

/** The calendar units (day, ISO week, month, quarter) a sample taken on `day` counts in, whatever the frequency. */
export function monitoringUnitsOf(day: string): string[] {
  const date = DateTime.fromISO(day, { zone: 'UTC' });
  return (['day', 'week', 'month', 'quarter'] as const).map((per) => unitKey(date, per));
}
