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
