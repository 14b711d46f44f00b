import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { UpdatePreferencesRequest } from '../../contracts/users.js';
import { endpoint } from '../../http/endpoint.js';
import { MeService } from './me.service.js';

export function meRoutes(dataSource: DataSource): Router {
  const router = Router();
  const me = new MeService(dataSource);

  router.get('/', ...endpoint({ action: 'signed-in' }, ({ user }) => me.get(user)));
  router.patch(
    '/preferences',
    ...endpoint({ action: 'signed-in', body: UpdatePreferencesRequest }, ({ user, body }) => me.updatePreferences(user, body)),
  );

  return router;
}
