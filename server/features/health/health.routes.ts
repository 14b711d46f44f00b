import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { HealthService } from './health.service.js';

/** Answers before sessions and sign-in, so it needs neither. */
export function healthRoutes(dataSource: DataSource): Router {
  const router = Router();
  const health = new HealthService(dataSource);
  router.get('/', async (_req, res) => {
    if (await health.databaseReachable()) res.json({ status: 'ok', db: 'ok' });
    else res.status(503).json({ status: 'degraded', db: 'unreachable' });
  });
  return router;
}
