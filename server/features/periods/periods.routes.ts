import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { IdParams } from '../../contracts/params.js';
import { PeriodListQuery, PeriodSummary, SubmissionRequest } from '../../contracts/periods.js';
import { endpoint } from '../../http/endpoint.js';
import { PeriodsService } from './periods.service.js';

export function periodsRoutes(dataSource: DataSource): Router {
  const router = Router();
  const periods = new PeriodsService(dataSource);

  router.get('/', ...endpoint({ action: 'periods.read', query: PeriodListQuery }, ({ user, query }) => periods.list(user, query)));
  router.get(
    '/:id/summary',
    ...endpoint({ action: 'periods.read', params: IdParams, response: PeriodSummary }, ({ user, params }) =>
      periods.summary(user, params.id),
    ),
  );
  router.post(
    '/:id/compile',
    ...endpoint({ action: 'periods.compile', params: IdParams, response: PeriodSummary }, ({ user, params }) =>
      periods.compile(user, params.id),
    ),
  );
  router.put(
    '/:id/submission',
    ...endpoint(
      { action: 'periods.compile', params: IdParams, body: SubmissionRequest, response: PeriodSummary },
      ({ user, params, body }) => periods.recordSubmission(user, params.id, body),
    ),
  );

  return router;
}
