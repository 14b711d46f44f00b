import { createHash } from 'node:crypto';

/** The same id for the same finding at every compile, so its follow-ups open once. */
export function stableId(...parts: string[]): string {
  const hex = createHash('sha256').update(parts.join('|')).digest('hex');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-4${hex.slice(13, 16)}-8${hex.slice(17, 20)}-${hex.slice(20, 32)}`;
}

type RowKey = { dischargePointId: string; parameterId: string };

/** An exceedance: keyed by point, parameter and day (or month), so one sample over two limits is one violation. */
export const exceedanceSourceId = (row: RowKey, date: string) => stableId(row.dischargePointId, row.parameterId, date);

/** A monitoring unit (day, week, month, quarter) with fewer samples than required. */
export const missedMonitoringSourceId = (row: RowKey, unit: string) => stableId(row.dischargePointId, row.parameterId, unit);

/** The source ids of every follow-up a compiled summary's exceedances and missed monitoring open. */
export function findingSourceIds(summary: {
  rows: Array<RowKey & { exceedances: Array<{ date: string }>; missedMonitoring: Array<{ unit: string }> }>;
}): string[] {
  const ids = summary.rows.flatMap((row) => [
    ...row.exceedances.map((e) => exceedanceSourceId(row, e.date)),
    ...row.missedMonitoring.map((m) => missedMonitoringSourceId(row, m.unit)),
  ]);
  return [...new Set(ids)];
}

const daysBefore = (day: string, count: number): string[] => {
  const start = Date.parse(`${day}T00:00:00Z`);
  return Array.from({ length: count }, (_, i) => new Date(start - (i + 1) * 86_400_000).toISOString().slice(0, 10));
};

/**
 * The exceedances a sample collected on `day` can be the repeat sample of: those of the 45 days
 * before it, and of its month and the two before (a monthly average is keyed by its month). The
 * repeat is due within 30 days of becoming aware (40 CFR 403.12(g)(2)).
 */
export function exceedancesRepeatedBy(row: RowKey, day: string): string[] {
  const months = [0, 1, 2].map((back) => {
    const date = new Date(Date.UTC(Number(day.slice(0, 4)), Number(day.slice(5, 7)) - 1 - back, 1));
    return date.toISOString().slice(0, 7);
  });
  return [...daysBefore(day, 45), ...months.slice(1)]
    .map((date) => exceedanceSourceId(row, date))
    .concat(
      // The sample's own month only answers an average whose tipping day came before it.
      exceedanceSourceId(row, months[0]!),
    );
}

/** An upkeep check overdue: keyed by the equipment and the day it fell due, so each missed interval opens once. */
export const upkeepDueSourceId = (equipmentId: string, dueOn: string) => stableId(equipmentId, dueOn);

/** The overdue-check follow-ups a check done on `day` answers: any due day in the year before it, or that day. */
export const upkeepDueAnsweredBy = (equipmentId: string, day: string): string[] =>
  [day, ...daysBefore(day, 366)].map((dueOn) => upkeepDueSourceId(equipmentId, dueOn));
