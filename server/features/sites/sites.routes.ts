import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { currentUser } from '../../auth/current-user.js';
import { notFound } from '../../errors/app-error.js';
import { requirePermission } from '../../middleware/require-permission.js';
import { validate } from '../../middleware/validate.js';
import { findSites } from './sites.repository.js';

export function sitesRoutes(dataSource: DataSource): Router {
  const router = Router();

  router.get('/', requirePermission('sites.read'), async (_req, res) => {
    res.json({ items: await findSites(dataSource, currentUser(res).siteIds) });
  });

  router.get('/:id', requirePermission('sites.read'), validate({ params: z.object({ id: z.uuid() }) }), async (_req, res) => {
    const { id } = res.locals.params as { id: string };
    // A site the user may not see answers as if it did not exist.
    if (!currentUser(res).siteIds.includes(id)) throw notFound('Site');
    const [site] = await findSites(dataSource, [id]);
    if (!site) throw notFound('Site');
    res.json(site);
  });

  return router;
}
