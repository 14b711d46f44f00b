import { Router } from 'express';
import type { DataSource, EntityManager } from 'typeorm';
import { z } from 'zod';
import { isoDate } from '../../contracts/fields.js';
import { PageQuery } from '../../contracts/paging.js';
import { currentUser, type CurrentUser } from '../../auth/current-user.js';
import { assertSiteAllowed } from '../../auth/site-access.js';
import { queryPage } from '../../db/page.js';
import { invalid } from '../../errors/app-error.js';
import { requirePermission } from '../../middleware/require-permission.js';
import { singleUpload } from '../../middleware/upload.js';
import { validate } from '../../middleware/validate.js';
import { rowErrorsBody, spreadsheetRows } from '../imports/spreadsheet-rows.js';
import { siteToday } from '../site-today.js';
import { recordTrail } from '../trail/trail.js';

const flowUnits = ['gal/day', 'MGD', 'm³/day'] as const;
export const flowColumns = [{ key: 'discharge_point_code' }, { key: 'day' }, { key: 'value' }, { key: 'unit' }] as const;
const FlowReadingRequest = z.object({
  dischargePointId: z.uuid('Not a valid id'),
  day: isoDate,
  value: z.number().finite().min(0, 'Cannot be negative').max(1e9),
  unit: z.enum(flowUnits),
});
const ListQuery = PageQuery.extend({ siteId: z.uuid('Not a valid id'), from: isoDate.optional(), to: isoDate.optional() });
const ImportFields = z.object({ siteId: z.uuid('Not a valid id'), commit: z.enum(['true', 'false']).default('false') });

type Reading = z.infer<typeof FlowReadingRequest>;

/** One reading a point a day: a second reading for the same day replaces the first, in the trail. */
async function upsertReading(manager: EntityManager, user: CurrentUser, siteId: string, reading: Reading): Promise<void> {
  const [before] = await manager.query('SELECT value, unit FROM flow_reading WHERE discharge_point_id = $1 AND day = $2', [reading.dischargePointId, reading.day]);
  const [row] = await manager.query(
    `INSERT INTO flow_reading (discharge_point_id, day, value, unit, entered_by) VALUES ($1, $2, $3, $4, $5)
     ON CONFLICT (discharge_point_id, day) DO UPDATE SET value = excluded.value, unit = excluded.unit, entered_by = excluded.entered_by
     RETURNING id`,
    [reading.dischargePointId, reading.day, reading.value, reading.unit, user.id],
  );
  await recordTrail(manager, user, {
    action: before ? 'update' : 'create', entity: 'flow-reading', entityId: row.id, siteId,
    before: before ? { value: Number(before.value), unit: before.unit } : null, after: reading,
  });
}

export function flowReadingsRoutes(dataSource: DataSource): Router {
  const router = Router();

  router.get('/', requirePermission('lab.read'), validate({ query: ListQuery }), async (_req, res) => {
    const query = res.locals.query as z.infer<typeof ListQuery>;
    assertSiteAllowed(currentUser(res), query.siteId);
    const from = 'FROM flow_reading f JOIN discharge_point d ON d.id = f.discharge_point_id';
    res.json(await queryPage(dataSource, {
      select: `SELECT f.id, f.discharge_point_id, d.code AS point_code, f.day::text, f.value, f.unit ${from}`,
      countFrom: from,
      where: `d.site_id = $1 AND ($2::date IS NULL OR f.day >= $2) AND ($3::date IS NULL OR f.day <= $3)`,
      order: 'f.day DESC, d.code',
      params: [query.siteId, query.from ?? null, query.to ?? null],
    }, query, (r: Record<string, any>) => ({ id: r.id, dischargePointId: r.discharge_point_id, pointCode: r.point_code, day: r.day, value: Number(r.value), unit: r.unit })));
  });

  router.post('/', requirePermission('lab.write'), validate({ body: FlowReadingRequest }), async (_req, res) => {
    const user = currentUser(res);
    const reading = res.locals.body as Reading;
    await dataSource.transaction(async (manager) => {
      const [point] = await manager.query('SELECT site_id FROM discharge_point WHERE id = $1', [reading.dischargePointId]);
      if (!point || !user.siteIds.includes(point.site_id)) throw invalid({ dischargePointId: 'No such discharge point at your sites' });
      if (reading.day > (await siteToday(manager, point.site_id))) throw invalid({ day: 'Cannot be in the future' });
      await upsertReading(manager, user, point.site_id, reading);
    });
    res.status(201).json(reading);
  });

  // Spreadsheet import: discharge_point_code, day, value, unit; a dry run, then all rows or none.
  router.post('/import', requirePermission('lab.write'), singleUpload(), validate({ body: ImportFields }), async (req, res) => {
    const user = currentUser(res);
    const { siteId, commit } = res.locals.body as z.infer<typeof ImportFields>;
    assertSiteAllowed(user, siteId);
    const rows = await spreadsheetRows<string>(req.file, flowColumns);
    const points = new Map<string, string>((await dataSource.query('SELECT code, id FROM discharge_point WHERE site_id = $1', [siteId])).map((r: { code: string; id: string }) => [r.code, r.id]));
    const today = await siteToday(dataSource, siteId);
    const readings: Reading[] = [];
    const errors: Array<{ row: number; column: string | null; message: string }> = [];
    let count = 0;
    for await (const { row, cells } of rows) {
      count += 1;
      const parsed = FlowReadingRequest.safeParse({
        dischargePointId: points.get(cells.discharge_point_code ?? '') ?? '00000000-0000-0000-0000-000000000000',
        day: cells.day, value: Number(cells.value), unit: cells.unit,
      });
      if (!points.has(cells.discharge_point_code ?? '')) errors.push({ row, column: 'discharge_point_code', message: 'No discharge point with this code at the site' });
      if (!parsed.success) for (const issue of parsed.error.issues) errors.push({ row, column: ({ dischargePointId: 'discharge_point_code' } as Record<string, string>)[String(issue.path[0])] ?? String(issue.path[0]), message: issue.message });
      else if (parsed.data.day > today) errors.push({ row, column: 'day', message: 'Cannot be in the future' });
      else if (points.has(cells.discharge_point_code ?? '')) readings.push(parsed.data);
    }
    const report = { committed: false, rows: count, readings: readings.length, errors: errors.slice(0, 500) };
    if (commit !== 'true') return res.json(report);
    if (errors.length > 0) return res.status(400).json(rowErrorsBody(report));
    await dataSource.transaction(async (manager) => {
      for (const reading of readings) await upsertReading(manager, user, siteId, reading);
    });
    res.status(201).json({ ...report, committed: true });
  });

  return router;
}
