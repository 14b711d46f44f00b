import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { TrailQuery, TrailVerification } from '../../contracts/trail.js';
import { sendDownload } from '../../http/download.js';
import { endpoint } from '../../http/endpoint.js';
import { TrailService } from './trail.service.js';

export function trailRoutes(dataSource: DataSource): Router {
  const router = Router();
  const trail = new TrailService(dataSource);

  router.get('/', ...endpoint({ action: 'trail.read', query: TrailQuery }, ({ user, query }) => trail.list(user, query)));
  router.get(
    '/export.csv',
    ...endpoint({ action: 'trail.read', query: TrailQuery }, async ({ user, query, res }) =>
      sendDownload(res, await trail.exportCsv(user, query)),
    ),
  );
  router.get('/verification', ...endpoint({ action: 'trail.read', response: TrailVerification }, () => trail.verify()));

  return router;
}
