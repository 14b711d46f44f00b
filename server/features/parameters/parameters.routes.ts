import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { CreateParameterRequest, UpdateParameterRequest } from '../../contracts/setup.js';
import { currentUser } from '../../auth/current-user.js';
import { assertSiteAllowed } from '../../auth/site-access.js';
import { camelRow, uniquely, type Row } from '../../db/rows.js';
import { forbidden } from '../../errors/app-error.js';
import { requirePermission } from '../../middleware/require-permission.js';
import { validate } from '../../middleware/validate.js';
import { createTraced, deleteTraced, updateTraced } from '../trail/traced-writes.js';

export const parameterTarget = {
  table: 'parameter',
  entity: 'parameter',
  view: (row: Row) => ({
    id: row.id as string,
    siteId: (row.siteId as string | null) ?? null,
    code: row.code as string,
    name: row.name as string,
    fraction: (row.fraction as 'HEM' | 'SGT-HEM' | null) ?? null,
    defaultUnit: row.defaultUnit as string,
    sncReviewFactor: row.sncReviewFactor === null ? null : Number(row.sncReviewFactor),
  }),
  siteIdOf: (row: Row) => (row.siteId as string | null) ?? null,
};
const IdParams = z.object({ id: z.uuid('Not a valid id') });
const ListQuery = z.object({ siteId: z.uuid().optional() });
const duplicate = 'A parameter with this code already exists';

/** The parameter catalogue: shared entries (no site) plus a site's own additions. */
export function parametersRoutes(dataSource: DataSource): Router {
  const router = Router();

  router.get('/', requirePermission('sites.read'), validate({ query: ListQuery }), async (_req, res) => {
    const user = currentUser(res);
    const rows: Row[] = await dataSource.query(
      `SELECT * FROM parameter WHERE (site_id IS NULL OR site_id = ANY($1::uuid[])) AND ($2::uuid IS NULL OR site_id IS NULL OR site_id = $2)
        ORDER BY site_id NULLS FIRST, name`,
      [user.siteIds, res.locals.query.siteId ?? null],
    );
    res.json({ items: rows.map((row) => parameterTarget.view(camelRow(row))) });
  });

  router.post('/', requirePermission('setup.manage'), validate({ body: CreateParameterRequest }), async (_req, res) => {
    const user = currentUser(res);
    const body = res.locals.body as z.infer<typeof CreateParameterRequest>;
    // A coordinator adds to their own site's catalogue; the shared catalogue is seeded data.
    if (!body.siteId) throw forbidden('Add a parameter to one of your sites (siteId)');
    assertSiteAllowed(user, body.siteId);
    res.status(201).json(await uniquely(() => createTraced(dataSource, user, parameterTarget, body), 'code', duplicate));
  });

  router.patch('/:id', requirePermission('setup.manage'), validate({ params: IdParams, body: UpdateParameterRequest }), async (_req, res) => {
    const user = currentUser(res);
    const updated = await uniquely(
      () =>
        updateTraced(dataSource, user, parameterTarget, res.locals.params.id, res.locals.body, async (_manager, before) => {
          if (!before.siteId) throw forbidden('The shared catalogue cannot be changed here');
          assertSiteAllowed(user, before.siteId as string);
        }),
      'code',
      duplicate,
    );
    res.json(updated);
  });

  router.delete('/:id', requirePermission('setup.manage'), validate({ params: IdParams }), async (_req, res) => {
    const user = currentUser(res);
    await deleteTraced(dataSource, user, parameterTarget, res.locals.params.id, async (_manager, before) => {
      if (!before.siteId) throw forbidden('The shared catalogue cannot be changed here');
      assertSiteAllowed(user, before.siteId as string);
    });
    res.status(204).end();
  });

  return router;
}
