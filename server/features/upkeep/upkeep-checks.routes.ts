import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { UpkeepCheckListQuery, UpkeepCheckRequest, PhotoUploadFields } from '../../contracts/oil.js';
import { FileParams } from '../../contracts/params.js';
import { endpoint } from '../../http/endpoint.js';
import { singleUpload } from '../../middleware/upload.js';
import { UpkeepChecksService } from './upkeep-checks.service.js';

export function upkeepChecksRoutes(dataSource: DataSource): Router {
  const router = Router();
  const upkeep = new UpkeepChecksService(dataSource);

  router.get(
    '/',
    ...endpoint({ action: 'oil-log.read', query: UpkeepCheckListQuery }, ({ user, query }) => upkeep.list(user, query.equipmentId)),
  );
  router.post(
    '/photos',
    ...endpoint({ action: 'oil-log.write', before: [singleUpload()], body: PhotoUploadFields, status: 201 }, ({ user, body, req }) =>
      upkeep.storePhoto(user, body.siteId, req.file),
    ),
  );
  router.get(
    '/photos/:fileId',
    ...endpoint({ action: 'oil-log.read', params: FileParams }, ({ user, params, res }) => upkeep.sendPhoto(user, params.fileId, res)),
  );
  router.post(
    '/',
    ...endpoint({ action: 'oil-log.write', body: UpkeepCheckRequest, status: 201 }, ({ user, body }) => upkeep.create(user, body)),
  );

  return router;
}
