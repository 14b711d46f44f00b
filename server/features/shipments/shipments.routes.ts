import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { IdParams, RecordFileParams } from '../../contracts/params.js';
import { CreateShipmentRequest, ShipmentQuery, UpdateShipmentRequest } from '../../contracts/shipments.js';
import { endpoint } from '../../http/endpoint.js';
import { singleUpload } from '../../middleware/upload.js';
import { ShipmentsService } from './shipments.service.js';

export function shipmentsRoutes(dataSource: DataSource): Router {
  const router = Router();
  const shipments = new ShipmentsService(dataSource);

  router.get('/', ...endpoint({ action: 'shipments.read', query: ShipmentQuery }, ({ user, query }) => shipments.list(user, query)));
  router.get('/:id', ...endpoint({ action: 'shipments.read', params: IdParams }, ({ user, params }) => shipments.get(user, params.id)));
  router.post(
    '/',
    ...endpoint({ action: 'shipments.write', body: CreateShipmentRequest, status: 201 }, ({ user, body }) => shipments.create(user, body)),
  );
  router.patch(
    '/:id',
    ...endpoint({ action: 'shipments.write', params: IdParams, body: UpdateShipmentRequest }, ({ user, params, body }) =>
      shipments.update(user, params.id, body),
    ),
  );
  router.post(
    '/:id/files',
    ...endpoint({ action: 'shipments.write', params: IdParams, before: [singleUpload()], status: 201 }, ({ user, params, req }) =>
      shipments.attachScan(user, params.id, req.file),
    ),
  );
  router.get(
    '/:id/files/:fileId',
    ...endpoint({ action: 'shipments.read', params: RecordFileParams }, ({ user, params, res }) =>
      shipments.sendScan(user, params.id, params.fileId, res),
    ),
  );

  return router;
}
