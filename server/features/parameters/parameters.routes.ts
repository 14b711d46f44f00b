import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { IdParams, OptionalSiteQuery } from '../../contracts/params.js';
import { CreateParameterRequest, UpdateParameterRequest } from '../../contracts/setup.js';
import { endpoint } from '../../http/endpoint.js';
import { ParametersService } from './parameters.service.js';

export function parametersRoutes(dataSource: DataSource): Router {
  const router = Router();
  const parameters = new ParametersService(dataSource);

  router.get(
    '/',
    ...endpoint({ action: 'sites.read', query: OptionalSiteQuery }, async ({ user, query }) => ({
      items: await parameters.list(user, query.siteId),
    })),
  );
  router.post(
    '/',
    ...endpoint({ action: 'setup.manage', body: CreateParameterRequest, status: 201 }, ({ user, body }) => parameters.create(user, body)),
  );
  router.patch(
    '/:id',
    ...endpoint({ action: 'setup.manage', params: IdParams, body: UpdateParameterRequest }, ({ user, params, body }) =>
      parameters.update(user, params.id, body),
    ),
  );
  router.delete(
    '/:id',
    ...endpoint({ action: 'setup.manage', params: IdParams }, ({ user, params }) => parameters.remove(user, params.id)),
  );

  return router;
}
