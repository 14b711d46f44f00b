import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { SiteParams, SiteRecordParams } from '../../contracts/params.js';
import { CreateDischargePointRequest, UpdateDischargePointRequest } from '../../contracts/setup.js';
import { endpoint } from '../../http/endpoint.js';
import { DischargePointsService } from './discharge-points.service.js';

/** Mounted at /api/sites/:siteId/discharge-points. */
export function dischargePointsRoutes(dataSource: DataSource): Router {
  const router = Router({ mergeParams: true });
  const points = new DischargePointsService(dataSource);

  router.get(
    '/',
    ...endpoint({ action: 'sites.read', params: SiteParams }, async ({ user, params }) => ({
      items: await points.list(user, params.siteId),
    })),
  );
  router.post(
    '/',
    ...endpoint({ action: 'setup.manage', params: SiteParams, body: CreateDischargePointRequest, status: 201 }, ({ user, params, body }) =>
      points.create(user, params.siteId, body),
    ),
  );
  router.patch(
    '/:id',
    ...endpoint({ action: 'setup.manage', params: SiteRecordParams, body: UpdateDischargePointRequest }, ({ user, params, body }) =>
      points.update(user, params.siteId, params.id, body),
    ),
  );
  router.delete(
    '/:id',
    ...endpoint({ action: 'setup.manage', params: SiteRecordParams }, ({ user, params }) => points.remove(user, params.siteId, params.id)),
  );

  return router;
}
