import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { CreateOilLogRequest, OilLogQuery, OilTotalsQuery, UpdateOilLogRequest } from '../../contracts/oil.js';
import { currentUser } from '../../auth/current-user.js';
import { assertSiteAllowed, assertSiteVisible } from '../../auth/site-access.js';
import { requirePermission } from '../../middleware/require-permission.js';
import { validate } from '../../middleware/validate.js';
import { OilLogService } from './oil-log.service.js';
import { findOilLogEntry, oilTotals, pageOilLog } from './oil-log.repository.js';

const IdParams = z.object({ id: z.uuid('Not a valid id') });

export function oilLogRoutes(dataSource: DataSource): Router {
  const router = Router();
  const service = new OilLogService(dataSource);

  router.get('/', requirePermission('oil-log.read'), validate({ query: OilLogQuery }), async (_req, res) => {
    const user = currentUser(res);
    const { siteId } = res.locals.query;
    if (siteId) assertSiteAllowed(user, siteId);
    res.json(await pageOilLog(dataSource, siteId ? [siteId] : user.siteIds, res.locals.query));
  });

  router.get('/totals', requirePermission('oil-log.read'), validate({ query: OilTotalsQuery }), async (_req, res) => {
    const query = res.locals.query as z.infer<typeof OilTotalsQuery>;
    assertSiteAllowed(currentUser(res), query.siteId);
    res.json({ by: query.by, items: await oilTotals(dataSource, query.siteId, query.by, query) });
  });

  router.get('/:id', requirePermission('oil-log.read'), validate({ params: IdParams }), async (_req, res) => {
    const entry = await findOilLogEntry(dataSource, res.locals.params.id);
    assertSiteVisible(currentUser(res), entry?.siteId, 'Oil log entry');
    res.json(entry);
  });

  router.post('/', requirePermission('oil-log.write'), validate({ body: CreateOilLogRequest }), async (_req, res) => {
    res.status(201).json(await service.create(currentUser(res), res.locals.body));
  });

  router.patch('/:id', requirePermission('oil-log.write'), validate({ params: IdParams, body: UpdateOilLogRequest }), async (_req, res) => {
    res.json(await service.update(currentUser(res), res.locals.params.id, res.locals.body));
  });

  return router;
}
