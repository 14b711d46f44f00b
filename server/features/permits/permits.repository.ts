import { DataSource, type EntityManager } from 'typeorm';
import { camelRow, selectRow, type Row } from '../../db/rows.js';

const isoDay = (value: unknown) => (value instanceof Date ? value.toISOString().slice(0, 10) : (value as string | null));

export const permitTarget = {
  table: 'permit',
  entity: 'permit',
  view: (row: Row) => ({
    id: row.id as string,
    siteId: row.siteId as string,
    kind: row.kind as 'pretreatment' | 'npdes',
    number: row.number as string,
    issuingAuthority: row.issuingAuthority as string,
    authorityEmail: (row.authorityEmail as string | null) ?? null,
    effectiveFrom: isoDay(row.effectiveFrom)!,
    effectiveTo: isoDay(row.effectiveTo) ?? null,
    reportingFrequency: row.reportingFrequency as string,
    reportDueDays: Number(row.reportDueDays),
    nonDetectPolicy: row.nonDetectPolicy as string,
    dailyMaxAppliesToEachGrab: row.dailyMaxAppliesToEachGrab as boolean,
    massLoadingFactor: Number(row.massLoadingFactor),
    sncWindow: row.sncWindow as string,
    lateReportDays: Number(row.lateReportDays),
  }),
  siteIdOf: (row: Row) => row.siteId as string,
};

export const limitTarget = (siteId: string) => ({
  table: 'permit_limit',
  entity: 'limit',
  view: (row: Row) => ({
    id: row.id as string,
    permitId: row.permitId as string,
    dischargePointId: row.dischargePointId as string,
    parameterId: row.parameterId as string,
    statistic: row.statistic as string,
    value: Number(row.value),
    unit: row.unit as string,
    frequencyCount: Number(row.frequencyCount),
    frequencyPer: row.frequencyPer as string,
    sampleType: row.sampleType as string,
    reportedDecimals: row.reportedDecimals === null || row.reportedDecimals === undefined ? null : Number(row.reportedDecimals),
  }),
  siteIdOf: () => siteId,
});

export async function findPermits(dataSource: DataSource, siteIds: string[]) {
  const rows: Row[] = await dataSource.query('SELECT * FROM permit WHERE site_id = ANY($1::uuid[]) ORDER BY effective_from DESC', [
    siteIds,
  ]);
  return rows.map((row) => permitTarget.view(camelRow(row)));
}

export async function findPermitRow(db: DataSource | EntityManager, id: string): Promise<Row | null> {
  return selectRow(db instanceof DataSource ? db.manager : db, 'permit', id);
}

export async function findLimits(dataSource: DataSource, permitId: string, siteId: string) {
  const rows: Row[] = await dataSource.query(
    `SELECT l.* FROM permit_limit l JOIN discharge_point d ON d.id = l.discharge_point_id
      WHERE l.permit_id = $1 ORDER BY d.code, l.parameter_id, l.statistic`,
    [permitId],
  );
  return rows.map((row) => limitTarget(siteId).view(camelRow(row)));
}

/** The discharge points a permit's limits apply to (their lab flags follow the limits). */
export async function limitedPointIds(dataSource: DataSource, permitId: string): Promise<string[]> {
  const rows: Array<{ discharge_point_id: string }> = await dataSource.query(
    'SELECT DISTINCT discharge_point_id FROM permit_limit WHERE permit_id = $1',
    [permitId],
  );
  return rows.map((row) => row.discharge_point_id);
}

export const findPointRow = (manager: EntityManager, id: string) => selectRow(manager, 'discharge_point', id);
export const findParameterRow = (manager: EntityManager, id: string) => selectRow(manager, 'parameter', id);
