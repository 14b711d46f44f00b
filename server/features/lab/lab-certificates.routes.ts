import { Router } from 'express';
import type { DataSource } from 'typeorm';
import {
  CertificateFileQuery,
  CertificateListQuery,
  CreateLabCertificateRequest,
  ResultListQuery,
  UpdateLabCertificateRequest,
} from '../../contracts/lab.js';
import { IdParams } from '../../contracts/params.js';
import { endpoint } from '../../http/endpoint.js';
import { jsonPart, singleUpload } from '../../middleware/upload.js';
import { mountRouter } from '../../openapi/mounts.js';
import { LabCertificatesService } from './lab-certificates.service.js';
import { labImportRoutes } from './lab-import.routes.js';

/** Mounted at /api/lab-certificates. */
export function labCertificatesRoutes(dataSource: DataSource): Router {
  const router = Router();
  const certificates = new LabCertificatesService(dataSource);

  router.get('/', ...endpoint({ action: 'lab.read', query: CertificateListQuery }, ({ user, query }) => certificates.list(user, query)));
  router.get(
    '/results',
    ...endpoint({ action: 'lab.read', query: ResultListQuery }, ({ user, query }) => certificates.listResults(user, query)),
  );
  mountRouter(router, '/import', labImportRoutes(dataSource, certificates));
  // JSON, or multipart with the PDF under `file` and the certificate as JSON under `certificate`.
  router.post(
    '/',
    ...endpoint(
      { action: 'lab.write', body: CreateLabCertificateRequest, before: [singleUpload(), jsonPart('certificate')], status: 201 },
      ({ user, body, req }) => certificates.create(user, body, req.file),
    ),
  );
  router.get('/:id', ...endpoint({ action: 'lab.read', params: IdParams }, ({ user, params }) => certificates.get(user, params.id)));
  router.put(
    '/:id',
    ...endpoint({ action: 'lab.write', params: IdParams, body: UpdateLabCertificateRequest }, ({ user, params, body }) =>
      certificates.update(user, params.id, body),
    ),
  );
  router.put(
    '/:id/file',
    ...endpoint({ action: 'lab.write', params: IdParams, before: [singleUpload()] }, ({ user, params, req }) =>
      certificates.attachFile(user, params.id, req.file),
    ),
  );
  router.get(
    '/:id/file',
    ...endpoint({ action: 'lab.read', params: IdParams, query: CertificateFileQuery }, ({ user, params, query, res }) =>
      certificates.sendFile(user, params.id, query.download === '1', res),
    ),
  );

  return router;
}
