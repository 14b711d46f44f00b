import type { DataSource, EntityManager } from 'typeorm';
import type { FlowReadingQuery, FlowReadingRequest, FlowReadingView } from '../../contracts/flow-readings.js';
import type { Page } from '../../contracts/paging.js';
import { queryPage } from '../../db/page.js';

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
  const [point]: Array<{ site_id: string }> = await db.query('SELECT site_id FROM discharge_point WHERE id = $1', [pointId]);
  return point?.site_id;
}

/** A site's discharge point ids by code, to read an import's rows. */
export async function pointIdsByCode(db: Db, siteId: string): Promise<Map<string, string>> {
  const rows: Array<{ code: string; id: string }> = await db.query('SELECT code, id FROM discharge_point WHERE site_id = $1', [siteId]);
  return new Map(rows.map((row) => [row.code, row.id]));
}

/** Writes a day's reading, replacing an earlier one; answers what it replaced (for the trail). */
export async function upsertFlowReading(
  manager: EntityManager,
  reading: FlowReadingRequest,
  enteredBy: string,
): Promise<{ id: string; before: { value: number; unit: string } | null }> {
  const [before]: Array<{ value: string; unit: string }> = await manager.query(
    'SELECT value, unit FROM flow_reading WHERE discharge_point_id = $1 AND day = $2',
    [reading.dischargePointId, reading.day],
  );
  const [row]: Array<{ id: string }> = await manager.query(
    `INSERT INTO flow_reading (discharge_point_id, day, value, unit, entered_by) VALUES ($1, $2, $3, $4, $5)
     ON CONFLICT (discharge_point_id, day) DO UPDATE SET value = excluded.value, unit = excluded.unit, entered_by = excluded.entered_by
     RETURNING id`,
    [reading.dischargePointId, reading.day, reading.value, reading.unit, enteredBy],
  );
  return { id: row!.id, before: before ? { value: Number(before.value), unit: before.unit } : null };
}
