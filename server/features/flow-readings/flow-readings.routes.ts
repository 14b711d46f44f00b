import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { FlowReadingQuery, FlowReadingRequest, type FlowImportReport } from '../../contracts/flow-readings.js';
import { SpreadsheetImportFields } from '../../contracts/imports.js';
import { endpoint } from '../../http/endpoint.js';
import { singleUpload } from '../../middleware/upload.js';
import { FlowReadingsService } from './flow-readings.service.js';

export function flowReadingsRoutes(dataSource: DataSource): Router {
  const router = Router();
  const flows = new FlowReadingsService(dataSource);

  router.get('/', ...endpoint({ action: 'lab.read', query: FlowReadingQuery }, ({ user, query }) => flows.list(user, query)));
  router.post(
    '/',
    ...endpoint({ action: 'lab.write', body: FlowReadingRequest, status: 201 }, ({ user, body }) => flows.record(user, body)),
  );
  router.post(
    '/import',
    ...endpoint(
      {
        action: 'lab.write',
        body: SpreadsheetImportFields,
        before: [singleUpload()],
        status: (report: FlowImportReport) => (report.committed ? 201 : 200),
      },
      ({ user, body, req }) => flows.import(user, body, req.file),
    ),
  );

  return router;
}
