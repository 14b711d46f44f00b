import { Router } from 'express';
import type { DataSource, EntityManager } from 'typeorm';
import { z } from 'zod';
import { CreateLimitRequest, CreatePermitRequest, UpdateLimitRequest, UpdatePermitRequest } from '../../contracts/setup.js';
import { currentUser } from '../../auth/current-user.js';
import { assertSiteAllowed, assertSiteVisible } from '../../auth/site-access.js';
import { camelRow, selectRow, uniquely, type Row } from '../../db/rows.js';
import { convert, isMassRate, units } from '../../domain/units.js';
import { invalid, notFound } from '../../errors/app-error.js';
import { requirePermission } from '../../middleware/require-permission.js';
import { validate } from '../../middleware/validate.js';
import { createTraced, deleteTraced, updateTraced } from '../trail/traced-writes.js';
import { recheckResultsAtPoint } from '../lab/lab-flags.service.js';
import { limitTarget, permitTarget } from './permit.views.js';
import { ensurePeriods } from '../periods/periods.service.js';

const IdParams = z.object({ id: z.uuid('Not a valid id') });
const LimitParams = IdParams.extend({ limitId: z.uuid('Not a valid id') });
const ListQuery = z.object({ siteId: z.uuid('Not a valid id').optional() });

export function permitsRoutes(dataSource: DataSource): Router {
  const router = Router();

  async function visiblePermit(res: Parameters<typeof currentUser>[0], id: string): Promise<Row> {
    const permit = await selectRow(dataSource.manager, 'permit', id);
    assertSiteVisible(currentUser(res), permit?.siteId as string | undefined, 'Permit');
    return permit!;
  }

  router.get('/', requirePermission('sites.read'), validate({ query: ListQuery }), async (_req, res) => {
    const user = currentUser(res);
    const siteId = res.locals.query.siteId as string | undefined;
    if (siteId) assertSiteAllowed(user, siteId);
    const rows: Row[] = await dataSource.query(
      'SELECT * FROM permit WHERE site_id = ANY($1::uuid[]) ORDER BY effective_from DESC',
      [siteId ? [siteId] : user.siteIds],
    );
    res.json({ items: rows.map((row) => permitTarget.view(camelRow(row))) });
  });

  router.get('/:id', requirePermission('sites.read'), validate({ params: IdParams }), async (_req, res) => {
    res.json(permitTarget.view(await visiblePermit(res, res.locals.params.id)));
  });

  router.post('/', requirePermission('setup.manage'), validate({ body: CreatePermitRequest }), async (_req, res) => {
    assertSiteAllowed(currentUser(res), res.locals.body.siteId);
    const created = await uniquely(
      () => createTraced(dataSource, currentUser(res), permitTarget, res.locals.body, { afterWrite: (manager, row) => ensurePeriods(manager, String(row.id)) }),
      'number',
      'This site already has a permit with this number',
    );
    res.status(201).json(created);
  });

  router.patch('/:id', requirePermission('setup.manage'), validate({ params: IdParams, body: UpdatePermitRequest }), async (_req, res) => {
    await visiblePermit(res, res.locals.params.id);
    const updated = await updateTraced(dataSource, currentUser(res), permitTarget, res.locals.params.id, res.locals.body, async (_m, before) => {
      const from = res.locals.body.effectiveFrom ?? before.effectiveFrom;
      const to = res.locals.body.effectiveTo === undefined ? before.effectiveTo : res.locals.body.effectiveTo;
      if (to && from && to < from) throw invalid({ effectiveTo: 'Ends before it starts' });
    });
    // New dates or a new frequency may add periods; existing ones stay as they were reported.
    await ensurePeriods(dataSource, res.locals.params.id);
    res.json(updated);
  });

  router.delete('/:id', requirePermission('setup.manage'), validate({ params: IdParams }), async (_req, res) => {
    await visiblePermit(res, res.locals.params.id);
    const points: Array<{ discharge_point_id: string }> = await dataSource.query(
      'SELECT DISTINCT discharge_point_id FROM permit_limit WHERE permit_id = $1',
      [res.locals.params.id],
    );
    await deleteTraced(dataSource, currentUser(res), permitTarget, res.locals.params.id);
    // Its limits went with it: the flags they raised must go too.
    await dataSource.transaction(async (manager) => {
      for (const point of points) await recheckResultsAtPoint(manager, point.discharge_point_id);
    });
    res.status(204).end();
  });

  router.get('/:id/limits', requirePermission('sites.read'), validate({ params: IdParams }), async (_req, res) => {
    const permit = await visiblePermit(res, res.locals.params.id);
    const rows: Row[] = await dataSource.query(
      `SELECT l.* FROM permit_limit l JOIN discharge_point d ON d.id = l.discharge_point_id
        WHERE l.permit_id = $1 ORDER BY d.code, l.parameter_id, l.statistic`,
      [permit.id],
    );
    res.json({ items: rows.map((row) => limitTarget(permit.siteId as string).view(camelRow(row))) });
  });

  router.post('/:id/limits', requirePermission('setup.manage'), validate({ params: IdParams, body: CreateLimitRequest }), async (_req, res) => {
    const permit = await visiblePermit(res, res.locals.params.id);
    const body = res.locals.body as z.infer<typeof CreateLimitRequest>;
    const created = await uniquely(
      () =>
        createTraced(dataSource, currentUser(res), limitTarget(permit.siteId as string), { ...body, permitId: permit.id }, {
          check: (manager) => checkLimit(manager, permit, body),
          afterWrite: (manager) => recheckResultsAtPoint(manager, body.dischargePointId),
        }),
      'statistic',
      'This permit already has this statistic for this point and parameter',
    );
    res.status(201).json(created);
  });

  router.patch('/:id/limits/:limitId', requirePermission('setup.manage'), validate({ params: LimitParams, body: UpdateLimitRequest }), async (_req, res) => {
    const permit = await visiblePermit(res, res.locals.params.id);
    const target = limitTarget(permit.siteId as string);
    const updated = await uniquely(
      () =>
        updateTraced(dataSource, currentUser(res), target, res.locals.params.limitId, res.locals.body, async (manager, before) => {
          if (before.permitId !== permit.id) throw notFound('Limit');
          await checkLimit(manager, permit, { ...target.view(before), ...res.locals.body });
        }),
      'statistic',
      'This permit already has this statistic for this point and parameter',
    );
    await dataSource.transaction((manager) => recheckResultsAtPoint(manager, updated.dischargePointId));
    res.json(updated);
  });

  router.delete('/:id/limits/:limitId', requirePermission('setup.manage'), validate({ params: LimitParams }), async (_req, res) => {
    const permit = await visiblePermit(res, res.locals.params.id);
    let pointId = '';
    await deleteTraced(dataSource, currentUser(res), limitTarget(permit.siteId as string), res.locals.params.limitId, async (_m, before) => {
      if (before.permitId !== permit.id) throw notFound('Limit');
      pointId = before.dischargePointId as string;
    });
    await dataSource.transaction((manager) => recheckResultsAtPoint(manager, pointId));
    res.status(204).end();
  });

  return router;
}

/** A limit's point must be of the permit's site, its parameter known there, its unit comparable. */
async function checkLimit(manager: EntityManager, permit: Row, limit: { dischargePointId: string; parameterId: string; unit: string; statistic: string }) {
  const point = await selectRow(manager, 'discharge_point', limit.dischargePointId);
  const parameter = await selectRow(manager, 'parameter', limit.parameterId);
  const fields: Record<string, string> = {};
  if (!point || point.siteId !== permit.siteId) fields.dischargePointId = 'Not a discharge point of this permit’s site';
  if (!parameter || (parameter.siteId && parameter.siteId !== permit.siteId)) fields.parameterId = 'Not a parameter of this site';
  else if (isMassRate(limit.unit)) {
    // A loading is computed from a concentration and the day's flow (40 CFR 122.45(f) mass limits).
    if (units[parameter.defaultUnit as string]?.dimension !== 'concentration') fields.unit = `${parameter.name as string} is not measured as a concentration, so it has no mass loading`;
    if (limit.statistic !== 'daily-maximum' && limit.statistic !== 'monthly-average') fields.statistic = 'A mass limit is a daily maximum or a monthly average';
  } else if (convert(1, limit.unit, parameter.defaultUnit as string) === null) {
    fields.unit = `Cannot be compared with ${parameter.name as string} (${parameter.defaultUnit as string})`;
  }
  if (Object.keys(fields).length > 0) throw invalid(fields);
}
