import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { CloseFollowUpRequest, CorrectAwarenessRequest, FollowUpQuery } from '../../contracts/follow-ups.js';
import { IdParams } from '../../contracts/params.js';
import { endpoint } from '../../http/endpoint.js';
import { singleUpload } from '../../middleware/upload.js';
import { FollowUpsService } from './follow-ups.service.js';
import { NoticeDraftRequest, SendNoticeRequest } from '../../contracts/notices.js';
import { AuthorityNoticeService } from '../notices/authority-notice.service.js';

export function followUpsRoutes(dataSource: DataSource): Router {
  const router = Router();
  const followUps = new FollowUpsService(dataSource);
  const notices = new AuthorityNoticeService(dataSource);

  router.get('/', ...endpoint({ action: 'follow-ups.read', query: FollowUpQuery }, ({ user, query }) => followUps.list(user, query)));
  // JSON, or multipart with the evidence under `file`.
  router.post(
    '/:id/close',
    ...endpoint(
      { action: 'follow-ups.close', params: IdParams, body: CloseFollowUpRequest, before: [singleUpload()] },
      ({ user, params, body, req }) => followUps.close(user, params.id, body, req.file),
    ),
  );
  router.post(
    '/:id/aware-since',
    ...endpoint({ action: 'follow-ups.close', params: IdParams, body: CorrectAwarenessRequest }, ({ user, params, body }) =>
      followUps.correctAwareness(user, params.id, body),
    ),
  );
  router.get(
    '/:id/notice',
    ...endpoint({ action: 'follow-ups.read', params: IdParams }, ({ user, params }) => notices.view(user, params.id)),
  );
  router.put(
    '/:id/notice',
    ...endpoint({ action: 'follow-ups.close', params: IdParams, body: NoticeDraftRequest }, ({ user, params, body }) =>
      notices.saveDraft(user, params.id, body),
    ),
  );
  router.post(
    '/:id/notice/send',
    ...endpoint({ action: 'follow-ups.close', params: IdParams, body: SendNoticeRequest }, ({ user, params, body }) =>
      notices.send(user, params.id, body),
    ),
  );
  router.get(
    '/:id/file',
    ...endpoint({ action: 'follow-ups.read', params: IdParams }, ({ user, params, res }) => followUps.sendFile(user, params.id, res)),
  );

  return router;
}
