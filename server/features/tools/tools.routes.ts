import { Router } from 'express';
import { TankCheckRequest } from '../../contracts/tools.js';
import { endpoint } from '../../http/endpoint.js';
import { tankCheck } from './tank-check.service.js';

/** Calculators for the equipment behind the numbers: estimates, computed on request, nothing stored. */
export function toolsRoutes(): Router {
  const router = Router();
  router.post('/tank-check', ...endpoint({ action: 'tools.use', body: TankCheckRequest }, ({ body }) => tankCheck(body)));
  return router;
}
