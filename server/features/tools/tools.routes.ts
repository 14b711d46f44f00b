import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { SkimmerFitQuery, TankCheckRequest } from '../../contracts/tools.js';
import { endpoint } from '../../http/endpoint.js';
import { skimmerFit } from './skimmer-fit.service.js';
import { tankCheck } from './tank-check.service.js';

/** Calculators for the equipment behind the numbers: estimates, computed on request, nothing stored. */
export function toolsRoutes(dataSource: DataSource): Router {
  const router = Router();
  router.post('/tank-check', ...endpoint({ action: 'tools.use', body: TankCheckRequest }, ({ body }) => tankCheck(body)));
  router.get(
    '/skimmer-fit',
    ...endpoint({ action: 'tools.use', query: SkimmerFitQuery }, ({ user, query }) => skimmerFit(dataSource, user, query.siteId)),
  );
  return router;
}
