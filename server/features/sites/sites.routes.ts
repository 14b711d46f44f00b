import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { CreateSiteRequest, UpdateSiteRequest } from '../../contracts/setup.js';
import { currentUser } from '../../auth/current-user.js';
import { assertSiteVisible } from '../../auth/site-access.js';
import { uniquely } from '../../db/rows.js';
import { notFound } from '../../errors/app-error.js';
import { requirePermission } from '../../middleware/require-permission.js';
import { validate } from '../../middleware/validate.js';
import { createTraced, deleteTraced, updateTraced } from '../trail/traced-writes.js';
import { siteTarget } from './site.views.js';
import { findSites } from './sites.repository.js';

const IdParams = z.object({ id: z.uuid('Not a valid id') });

export function sitesRoutes(dataSource: DataSource): Router {
  const router = Router();

  router.get('/', requirePermission('sites.read'), async (_req, res) => {
    res.json({ items: await findSites(dataSource, currentUser(res).siteIds) });
  });

  router.get('/:id', requirePermission('sites.read'), validate({ params: IdParams }), async (_req, res) => {
    const { id } = res.locals.params as { id: string };
    assertSiteVisible(currentUser(res), id, 'Site');
    const [site] = await findSites(dataSource, [id]);
    if (!site) throw notFound('Site');
    res.json(site);
  });

  // A new site joins the company of the coordinator's sites; its creator gets access to it.
  router.post('/', requirePermission('setup.manage'), validate({ body: CreateSiteRequest }), async (_req, res) => {
    const user = currentUser(res);
    const [company] = await dataSource.query(
      `SELECT coalesce((SELECT company_id FROM site WHERE id = ANY($1::uuid[]) LIMIT 1),
                       (SELECT id FROM company ORDER BY created_at LIMIT 1)) AS company_id`,
      [user.siteIds],
    );
    const created = await uniquely(
      () =>
        createTraced(dataSource, user, siteTarget, { ...res.locals.body, companyId: company.company_id }, {
          afterWrite: async (manager, row) => {
            await manager.query('INSERT INTO user_site (user_id, site_id) VALUES ($1, $2)', [user.id, row.id]);
          },
        }),
      'name',
      'A site with this name already exists',
    );
    res.status(201).json((await findSites(dataSource, [created.id]))[0]);
  });

  router.patch('/:id', requirePermission('setup.manage'), validate({ params: IdParams, body: UpdateSiteRequest }), async (_req, res) => {
    const { id } = res.locals.params as { id: string };
    assertSiteVisible(currentUser(res), id, 'Site');
    await updateTraced(dataSource, currentUser(res), siteTarget, id, res.locals.body);
    res.json((await findSites(dataSource, [id]))[0]);
  });

  // Only a site with no records left: every table that refers to a site refuses the delete.
  router.delete('/:id', requirePermission('setup.manage'), validate({ params: IdParams }), async (_req, res) => {
    const { id } = res.locals.params as { id: string };
    assertSiteVisible(currentUser(res), id, 'Site');
    await deleteTraced(dataSource, currentUser(res), siteTarget, id, async (manager) => {
      await manager.query('DELETE FROM user_site WHERE site_id = $1', [id]);
    });
    res.status(204).end();
  });

  return router;
}
