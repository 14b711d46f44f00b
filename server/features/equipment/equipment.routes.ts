import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { CreateEquipmentRequest, UpdateEquipmentRequest } from '../../contracts/oil.js';
import { IdParams, SiteQuery } from '../../contracts/params.js';
import { endpoint } from '../../http/endpoint.js';
import { EquipmentService } from './equipment.service.js';

export function equipmentRoutes(dataSource: DataSource): Router {
  const router = Router();
  const equipment = new EquipmentService(dataSource);

  router.get(
    '/',
    ...endpoint({ action: 'oil-log.read', query: SiteQuery }, async ({ user, query }) => ({
      items: await equipment.list(user, query.siteId),
    })),
  );
  router.get('/:id', ...endpoint({ action: 'oil-log.read', params: IdParams }, ({ user, params }) => equipment.get(user, params.id)));
  router.post(
    '/',
    ...endpoint({ action: 'setup.manage', body: CreateEquipmentRequest, status: 201 }, ({ user, body }) => equipment.create(user, body)),
  );
  router.patch(
    '/:id',
    ...endpoint({ action: 'setup.manage', params: IdParams, body: UpdateEquipmentRequest }, ({ user, params, body }) =>
      equipment.update(user, params.id, body),
    ),
  );
  router.delete('/:id', ...endpoint({ action: 'setup.manage', params: IdParams }, ({ user, params }) => equipment.remove(user, params.id)));

  return router;
}
