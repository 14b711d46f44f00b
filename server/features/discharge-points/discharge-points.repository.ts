import type { DataSource } from 'typeorm';
import type { DischargePoint as DischargePointView } from '../../contracts/setup.js';
import type { Target } from '../../kernel/trail/traced-writes.js';
import { DischargePoint } from './discharge-point.entity.js';

/** How a discharge point is written and shown (for the traced writes). */
export const dischargePointTarget = {
  entityClass: DischargePoint,
  entity: 'discharge-point',
  view: (row: DischargePoint): DischargePointView => ({
    id: row.id,
    siteId: row.siteId,
    code: row.code,
    name: row.name,
    receiving: row.receiving,
    active: row.active,
  }),
  siteIdOf: (row: DischargePoint) => row.siteId,
  insteadOfDelete: 'Mark it inactive instead: its samples and limits stay.',
} satisfies Target<DischargePoint, DischargePointView>;

export async function findDischargePoints(dataSource: DataSource, siteId: string): Promise<DischargePointView[]> {
  const rows = await dataSource.manager.find(DischargePoint, { where: { siteId }, order: { code: 'ASC' } });
  return rows.map(dischargePointTarget.view);
}
