import type { DataSource } from 'typeorm';
import type { DischargePoint } from '../../contracts/setup.js';
import { camelRow, type Row } from '../../db/rows.js';

/** How a discharge point row is written and shown (for the traced writes). */
export const dischargePointTarget = {
  table: 'discharge_point',
  entity: 'discharge-point',
  view: (row: Row): DischargePoint => ({
    id: row.id as string,
    siteId: row.siteId as string,
    code: row.code as string,
    name: row.name as string,
    receiving: row.receiving as DischargePoint['receiving'],
    active: row.active as boolean,
  }),
  siteIdOf: (row: Row) => row.siteId as string,
};

export async function findDischargePoints(dataSource: DataSource, siteId: string): Promise<DischargePoint[]> {
  const rows: Row[] = await dataSource.query('SELECT * FROM discharge_point WHERE site_id = $1 ORDER BY code', [siteId]);
  return rows.map((row) => dischargePointTarget.view(camelRow(row)));
}
