import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { CertificateListQuery, CreateLabCertificateRequest, ResultListQuery, UpdateLabCertificateRequest } from '../../contracts/lab.js';
import { currentUser } from '../../auth/current-user.js';
import { assertSiteAllowed } from '../../auth/site-access.js';
import { notFound } from '../../errors/app-error.js';
import { requirePermission } from '../../middleware/require-permission.js';
import { jsonPart, singleUpload } from '../../middleware/upload.js';
import { validate } from '../../middleware/validate.js';
import { mountRouter } from '../../openapi/mounts.js';
import { sendStoredFile } from '../files/stored-files.js';
import { labImportRoutes } from './lab-import.routes.js';
import { LabCertificatesService } from './lab-certificates.service.js';
import { pageCertificates, pageResults } from './lab.repository.js';

const IdParams = z.object({ id: z.uuid('Not a valid id') });
const FileQuery = z.object({ download: z.enum(['0', '1']).optional() });

/** Mounted at /api/lab-certificates. */
export function labCertificatesRoutes(dataSource: DataSource): Router {
  const router = Router();
  const service = new LabCertificatesService(dataSource);
  const scope = (res: Parameters<typeof currentUser>[0], siteId?: string) => {
    const user = currentUser(res);
    if (siteId) assertSiteAllowed(user, siteId);
    return siteId ? [siteId] : user.siteIds;
  };

  router.get('/', requirePermission('lab.read'), validate({ query: CertificateListQuery }), async (_req, res) => {
    res.json(await pageCertificates(dataSource, scope(res, res.locals.query.siteId), res.locals.query));
  });

  router.get('/results', requirePermission('lab.read'), validate({ query: ResultListQuery }), async (_req, res) => {
    res.json(await pageResults(dataSource, scope(res, res.locals.query.siteId), res.locals.query));
  });

  mountRouter(router, '/import', labImportRoutes(dataSource, service));

  router.post(
    '/',
    requirePermission('lab.write'),
    singleUpload(),
    jsonPart('certificate'),
    validate({ body: CreateLabCertificateRequest }),
    async (req, res) => {
      res.status(201).json(await service.create(currentUser(res), res.locals.body, req.file));
    },
  );

  router.get('/:id', requirePermission('lab.read'), validate({ params: IdParams }), async (_req, res) => {
    res.json(await service.visible(dataSource, currentUser(res), res.locals.params.id));
  });

  router.put('/:id', requirePermission('lab.write'), validate({ params: IdParams, body: UpdateLabCertificateRequest }), async (_req, res) => {
    res.json(await service.update(currentUser(res), res.locals.params.id, res.locals.body));
  });

  router.put('/:id/file', requirePermission('lab.write'), validate({ params: IdParams }), singleUpload(), async (req, res) => {
    res.json(await service.attachFile(currentUser(res), res.locals.params.id, req.file));
  });

  router.get('/:id/file', requirePermission('lab.read'), validate({ params: IdParams, query: FileQuery }), async (_req, res) => {
    const certificate = await service.visible(dataSource, currentUser(res), res.locals.params.id);
    if (!certificate.file) throw notFound('Certificate file');
    await sendStoredFile(dataSource.manager, certificate.file.id, res, res.locals.query.download !== '1');
  });

  return router;
}
