import { DateTime } from 'luxon';

export type ReportingFrequency = 'monthly' | 'quarterly' | 'semiannual';
const months: Record<ReportingFrequency, number> = { monthly: 1, quarterly: 3, semiannual: 6 };

export interface ReportingPeriod {
  startsOn: string;
  endsOn: string;
  dueOn: string;
}

/**
 * The reporting periods of a permit: calendar months, quarters or halves, clipped to the
 * permit's effective dates, up to the period that contains `until`. Due = end + due days.
 */
export function reportingPeriods(
  permit: { effectiveFrom: string; effectiveTo: string | null; reportingFrequency: ReportingFrequency; reportDueDays: number },
  until: string,
): ReportingPeriod[] {
  const step = months[permit.reportingFrequency];
  const from = DateTime.fromISO(permit.effectiveFrom, { zone: 'UTC' });
  const last = DateTime.fromISO(permit.effectiveTo && permit.effectiveTo < until ? permit.effectiveTo : until, { zone: 'UTC' });
  const periods: ReportingPeriod[] = [];
  let start = from.startOf('month').set({ month: Math.floor((from.month - 1) / step) * step + 1 });
  while (start <= last) {
    const end = start.plus({ months: step }).minus({ days: 1 });
    const startsOn = (start < from ? from : start).toISODate()!;
    const clippedEnd = permit.effectiveTo && end.toISODate()! > permit.effectiveTo ? permit.effectiveTo : end.toISODate()!;
    periods.push({
      startsOn,
      endsOn: clippedEnd,
      dueOn: DateTime.fromISO(clippedEnd, { zone: 'UTC' }).plus({ days: permit.reportDueDays }).toISODate()!,
    });
    start = start.plus({ months: step });
  }
  return periods;
}
