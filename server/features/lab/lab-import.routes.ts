import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { SpreadsheetImportFields } from '../../contracts/imports.js';
import { ImportTemplateQuery, type ImportReport } from '../../contracts/lab-import.js';
import { sendDownload } from '../../http/download.js';
import { endpoint } from '../../http/endpoint.js';
import { singleUpload } from '../../middleware/upload.js';
import type { LabCertificatesService } from './lab-certificates.service.js';
import { LabImportService } from './lab-import.service.js';

/** Mounted at /api/lab-certificates/import. */
export function labImportRoutes(dataSource: DataSource, certificates: LabCertificatesService): Router {
  const router = Router();
  const imports = new LabImportService(dataSource, certificates);

  router.get(
    '/template',
    ...endpoint({ action: 'lab.read', query: ImportTemplateQuery }, async ({ user, query, res }) =>
      sendDownload(res, await imports.template(user, query)),
    ),
  );
  router.post(
    '/',
    ...endpoint(
      {
        action: 'lab.write',
        body: SpreadsheetImportFields,
        before: [singleUpload()],
        status: (report: ImportReport) => (report.committed ? 201 : 200),
      },
      ({ user, body, req }) => imports.import(user, body, req.file),
    ),
  );

  return router;
}
