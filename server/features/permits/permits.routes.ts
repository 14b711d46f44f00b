import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { IdParams, LimitParams, OptionalSiteQuery } from '../../contracts/params.js';
import { CreateLimitRequest, CreatePermitRequest, EndLimitQuery, UpdateLimitRequest, UpdatePermitRequest } from '../../contracts/setup.js';
import { endpoint } from '../../http/endpoint.js';
import { PermitsService } from './permits.service.js';

export function permitsRoutes(dataSource: DataSource): Router {
  const router = Router();
  const permits = new PermitsService(dataSource);

  router.get(
    '/',
    ...endpoint({ action: 'sites.read', query: OptionalSiteQuery }, async ({ user, query }) => ({
      items: await permits.list(user, query.siteId),
    })),
  );
  router.get('/:id', ...endpoint({ action: 'sites.read', params: IdParams }, ({ user, params }) => permits.get(user, params.id)));
  router.post(
    '/',
    ...endpoint({ action: 'setup.manage', body: CreatePermitRequest, status: 201 }, ({ user, body }) => permits.create(user, body)),
  );
  router.patch(
    '/:id',
    ...endpoint({ action: 'setup.manage', params: IdParams, body: UpdatePermitRequest }, ({ user, params, body }) =>
      permits.update(user, params.id, body),
    ),
  );
  router.delete('/:id', ...endpoint({ action: 'setup.manage', params: IdParams }, ({ user, params }) => permits.remove(user, params.id)));

  router.get(
    '/:id/limits',
    ...endpoint({ action: 'sites.read', params: IdParams }, async ({ user, params }) => ({ items: await permits.limits(user, params.id) })),
  );
  router.post(
    '/:id/limits',
    ...endpoint({ action: 'setup.manage', params: IdParams, body: CreateLimitRequest, status: 201 }, ({ user, params, body }) =>
      permits.createLimit(user, params.id, body),
    ),
  );
  router.patch(
    '/:id/limits/:limitId',
    ...endpoint({ action: 'setup.manage', params: LimitParams, body: UpdateLimitRequest }, ({ user, params, body }) =>
      permits.updateLimit(user, params.id, params.limitId, body),
    ),
  );
  router.delete(
    '/:id/limits/:limitId',
    ...endpoint({ action: 'setup.manage', params: LimitParams, query: EndLimitQuery }, ({ user, params, query }) =>
      permits.removeLimit(user, params.id, params.limitId, query),
    ),
  );

  return router;
}
