import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { CreateOilLogRequest, OilLogQuery, OilTotalsQuery, UpdateOilLogRequest } from '../../contracts/oil.js';
import { IdParams } from '../../contracts/params.js';
import { endpoint } from '../../http/endpoint.js';
import { OilLogService } from './oil-log.service.js';

export function oilLogRoutes(dataSource: DataSource): Router {
  const router = Router();
  const oilLog = new OilLogService(dataSource);

  router.get('/', ...endpoint({ action: 'oil-log.read', query: OilLogQuery }, ({ user, query }) => oilLog.list(user, query)));
  router.get('/totals', ...endpoint({ action: 'oil-log.read', query: OilTotalsQuery }, ({ user, query }) => oilLog.totals(user, query)));
  router.get('/:id', ...endpoint({ action: 'oil-log.read', params: IdParams }, ({ user, params }) => oilLog.get(user, params.id)));
  router.post(
    '/',
    ...endpoint({ action: 'oil-log.write', body: CreateOilLogRequest, status: 201 }, ({ user, body }) => oilLog.create(user, body)),
  );
  router.patch(
    '/:id',
    ...endpoint({ action: 'oil-log.write', params: IdParams, body: UpdateOilLogRequest }, ({ user, params, body }) =>
      oilLog.update(user, params.id, body),
    ),
  );

  return router;
}
