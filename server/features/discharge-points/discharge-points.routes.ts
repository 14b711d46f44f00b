import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { CreateDischargePointRequest, UpdateDischargePointRequest } from '../../contracts/setup.js';
import { currentUser } from '../../auth/current-user.js';
import { assertSiteVisible } from '../../auth/site-access.js';
import { camelRow, uniquely, type Row } from '../../db/rows.js';
import { notFound } from '../../errors/app-error.js';
import { requirePermission } from '../../middleware/require-permission.js';
import { validate } from '../../middleware/validate.js';
import { createTraced, deleteTraced, updateTraced } from '../trail/traced-writes.js';

const target = {
  table: 'discharge_point',
  entity: 'discharge-point',
  view: (row: Row) => ({
    id: row.id as string, siteId: row.siteId as string, code: row.code as string, name: row.name as string,
    receiving: row.receiving as string, active: row.active as boolean,
  }),
  siteIdOf: (row: Row) => row.siteId as string,
};
const SiteParams = z.object({ siteId: z.uuid('Not a valid id') });
const PointParams = SiteParams.extend({ id: z.uuid('Not a valid id') });
const duplicateCode = 'This site already has a discharge point with this code';

/** Mounted at /api/sites/:siteId/discharge-points. */
export function dischargePointsRoutes(dataSource: DataSource): Router {
  const router = Router({ mergeParams: true });

  router.get('/', requirePermission('sites.read'), validate({ params: SiteParams }), async (_req, res) => {
    const { siteId } = res.locals.params;
    assertSiteVisible(currentUser(res), siteId, 'Site');
    const rows: Row[] = await dataSource.query('SELECT * FROM discharge_point WHERE site_id = $1 ORDER BY code', [siteId]);
    res.json({ items: rows.map((row) => target.view(camelRow(row))) });
  });

  router.post('/', requirePermission('setup.manage'), validate({ params: SiteParams, body: CreateDischargePointRequest }), async (_req, res) => {
    const { siteId } = res.locals.params;
    assertSiteVisible(currentUser(res), siteId, 'Site');
    const created = await uniquely(
      () => createTraced(dataSource, currentUser(res), target, { ...res.locals.body, siteId }),
      'code',
      duplicateCode,
    );
    res.status(201).json(created);
  });

  router.patch('/:id', requirePermission('setup.manage'), validate({ params: PointParams, body: UpdateDischargePointRequest }), async (_req, res) => {
    const { siteId, id } = res.locals.params;
    assertSiteVisible(currentUser(res), siteId, 'Site');
    const updated = await uniquely(
      () =>
        updateTraced(dataSource, currentUser(res), target, id, res.locals.body, async (_manager, before) => {
          if (before.siteId !== siteId) throw notFound('Discharge point');
        }),
      'code',
      duplicateCode,
    );
    res.json(updated);
  });

  router.delete('/:id', requirePermission('setup.manage'), validate({ params: PointParams }), async (_req, res) => {
    const { siteId, id } = res.locals.params;
    assertSiteVisible(currentUser(res), siteId, 'Site');
    await deleteTraced(dataSource, currentUser(res), target, id, async (_manager, before) => {
      if (before.siteId !== siteId) throw notFound('Discharge point');
    });
    res.status(204).end();
  });

  return router;
}
