import type { DataSource, EntityManager } from 'typeorm';
import type { FlowReadingQuery, FlowReadingRequest, FlowReadingView } from '../../contracts/flow-readings.js';
import type { Page } from '../../contracts/paging.js';
import { queryPage } from '../../db/page.js';
import { DischargePoint } from '../discharge-points/discharge-point.entity.js';
import { FlowReading } from './flow-reading.entity.js';

type Db = DataSource | EntityManager;

interface FlowReadingRow {
  id: string;
  discharge_point_id: string;
  point_code: string;
  day: string;
  value: string;
  unit: FlowReadingView['unit'];
}

const from = 'FROM flow_reading f JOIN discharge_point d ON d.id = f.discharge_point_id';

// Raw SQL: the page and its count over one filter, read at once (server/db/page.ts).
export function pageFlowReadings(db: Db, query: FlowReadingQuery): Promise<Page<FlowReadingView>> {
  return queryPage(
    db,
    {
      select: `SELECT f.id, f.discharge_point_id, d.code AS point_code, f.day::text, f.value, f.unit ${from}`,
      countFrom: from,
      where: `d.site_id = $1 AND ($2::date IS NULL OR f.day >= $2) AND ($3::date IS NULL OR f.day <= $3)`,
      order: 'f.day DESC, d.code',
      params: [query.siteId, query.from ?? null, query.to ?? null],
    },
    query,
    (row: FlowReadingRow) => ({
      id: row.id,
      dischargePointId: row.discharge_point_id,
      pointCode: row.point_code,
      day: row.day,
      value: Number(row.value),
      unit: row.unit,
    }),
  );
}

export async function findPointSiteId(db: Db, pointId: string): Promise<string | undefined> {
  return (await db.getRepository(DischargePoint).findOne({ where: { id: pointId }, select: { siteId: true } }))?.siteId;
}

/** A site's discharge point ids by code, to read an import's rows. */
export async function pointIdsByCode(db: Db, siteId: string): Promise<Map<string, string>> {
  const points = await db.getRepository(DischargePoint).find({ where: { siteId }, select: { id: true, code: true } });
  return new Map(points.map((point) => [point.code, point.id]));
}

/** Writes a day's reading, replacing an earlier one; answers what it replaced (for the trail). */
export async function upsertFlowReading(
  manager: EntityManager,
  reading: FlowReadingRequest,
  enteredBy: string,
): Promise<{ id: string; before: { value: number; unit: string } | null }> {
  const before = await manager.findOne(FlowReading, {
    where: { dischargePointId: reading.dischargePointId, day: reading.day },
    select: { value: true, unit: true },
  });
  await manager.upsert(FlowReading, { ...reading, enteredBy }, ['dischargePointId', 'day']);
  const row = await manager.findOneByOrFail(FlowReading, { dischargePointId: reading.dischargePointId, day: reading.day });
  return { id: row.id, before: before ? { value: before.value, unit: before.unit } : null };
}
