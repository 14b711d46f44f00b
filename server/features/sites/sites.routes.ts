import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { IdParams } from '../../contracts/params.js';
import { CreateSiteRequest, UpdateSiteRequest } from '../../contracts/setup.js';
import { endpoint } from '../../http/endpoint.js';
import { SitesService } from './sites.service.js';

export function sitesRoutes(dataSource: DataSource): Router {
  const router = Router();
  const sites = new SitesService(dataSource);

  router.get('/', ...endpoint({ action: 'sites.read' }, async ({ user }) => ({ items: await sites.list(user) })));
  router.get('/:id', ...endpoint({ action: 'sites.read', params: IdParams }, ({ user, params }) => sites.get(user, params.id)));
  router.post(
    '/',
    ...endpoint({ action: 'setup.manage', body: CreateSiteRequest, status: 201 }, ({ user, body }) => sites.create(user, body)),
  );
  router.patch(
    '/:id',
    ...endpoint({ action: 'setup.manage', params: IdParams, body: UpdateSiteRequest }, ({ user, params, body }) =>
      sites.update(user, params.id, body),
    ),
  );
  router.delete('/:id', ...endpoint({ action: 'setup.manage', params: IdParams }, ({ user, params }) => sites.remove(user, params.id)));

  return router;
}
