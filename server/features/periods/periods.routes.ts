import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { IdParams } from '../../contracts/params.js';
import { authenticatedAt } from '../../auth/session.js';
import {
  AmendRequest,
  PeriodListQuery,
  PeriodSummary,
  Revision,
  RevisionParams,
  SignOffChecklist,
  SignRequest,
  SubmissionRequest,
} from '../../contracts/periods.js';
import { z } from 'zod';
import { sendDownload } from '../../http/download.js';
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

  router.get(
    '/:id/sign-off',
    ...endpoint({ action: 'periods.sign', params: IdParams, response: SignOffChecklist }, ({ user, params, req }) =>
      periods.signOffChecklist(user, params.id, authenticatedAt(req.session)),
    ),
  );
  router.post(
    '/:id/sign',
    ...endpoint({ action: 'periods.sign', params: IdParams, body: SignRequest, response: PeriodSummary }, ({ user, params, body, req }) =>
      periods.sign(user, params.id, body, authenticatedAt(req.session)),
    ),
  );
  router.post(
    '/:id/amendments',
    ...endpoint(
      { action: 'periods.amend', params: IdParams, body: AmendRequest, response: PeriodSummary, status: 201 },
      ({ user, params, body }) => periods.amend(user, params.id, body),
    ),
  );
  router.get(
    '/:id/revisions',
    ...endpoint({ action: 'periods.read', params: IdParams, response: z.object({ items: z.array(Revision) }) }, ({ user, params }) =>
      periods.revisions(user, params.id),
    ),
  );
  router.get(
    '/:id/revisions/:revision',
    ...endpoint({ action: 'periods.read', params: RevisionParams, response: PeriodSummary }, ({ user, params }) =>
      periods.revision(user, params.id, params.revision),
    ),
  );

  router.get(
    '/:id/pack.pdf',
    ...endpoint({ action: 'periods.read', params: IdParams }, async ({ user, params, res }) =>
      sendDownload(res, await periods.packPdf(user, params.id)),
    ),
  );
  router.get(
    '/:id/evidence.zip',
    ...endpoint({ action: 'periods.read', params: IdParams }, ({ user, params, res }) => periods.bundle(user, params.id, res)),
  );
  router.get(
    '/:id/pack.xlsx',
    ...endpoint({ action: 'periods.read', params: IdParams }, async ({ user, params, res }) =>
      sendDownload(res, await periods.packXlsx(user, params.id)),
    ),
  );
  router.get(
    '/:id/revisions/:revision/pack.pdf',
    ...endpoint({ action: 'periods.read', params: RevisionParams }, async ({ user, params, res }) =>
      sendDownload(res, await periods.packPdf(user, params.id, params.revision)),
    ),
  );
  router.get(
    '/:id/revisions/:revision/pack.xlsx',
    ...endpoint({ action: 'periods.read', params: RevisionParams }, async ({ user, params, res }) =>
      sendDownload(res, await periods.packXlsx(user, params.id, params.revision)),
    ),
  );

  return router;
}
