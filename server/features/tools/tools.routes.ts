import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { ApplicationSheetQuery, SaveApplicationSheetRequest } from '../../contracts/application-sheet.js';
import { IdParams } from '../../contracts/params.js';
import {
  AttachTankCheckRequest,
  SaveTankCheckRequest,
  SkimmerFitQuery,
  TankCheckListQuery,
  TankCheckRequest,
  TankCheckStartQuery,
} from '../../contracts/tools.js';
import { sendDownload } from '../../http/download.js';
import { endpoint } from '../../http/endpoint.js';
import { ApplicationSheetsService } from './application-sheets.service.js';
import { skimmerFit } from './skimmer-fit.service.js';
import { tankCheck } from './tank-check.service.js';
import { TankChecksService } from './tank-checks.service.js';

/**
 * The tools for the equipment behind the numbers: application sheets (kept with history), the
 * tank check (computed on request, kept when saved) and skimmer fit. Everyone who sees the
 * equipment reads the sheets and kept checks; those who use the tools write them.
 */
export function toolsRoutes(dataSource: DataSource): Router {
  const router = Router();
  const sheets = new ApplicationSheetsService(dataSource);
  const checks = new TankChecksService(dataSource);

  router.post('/tank-check', ...endpoint({ action: 'tools.use', body: TankCheckRequest }, ({ body }) => tankCheck(body)));
  router.get(
    '/tank-check/start',
    ...endpoint({ action: 'tools.use', query: TankCheckStartQuery }, ({ user, query }) => checks.start(user, query)),
  );
  router.get(
    '/tank-checks',
    ...endpoint({ action: 'oil-log.read', query: TankCheckListQuery }, ({ user, query }) => checks.list(user, query)),
  );
  router.get(
    '/tank-checks/:id',
    ...endpoint({ action: 'oil-log.read', params: IdParams }, ({ user, params }) => checks.get(user, params.id)),
  );
  router.post(
    '/tank-checks',
    ...endpoint({ action: 'tools.use', body: SaveTankCheckRequest, status: 201 }, ({ user, body }) => checks.save(user, body)),
  );
  router.post(
    '/tank-checks/:id/attach',
    ...endpoint({ action: 'tools.use', params: IdParams, body: AttachTankCheckRequest }, ({ user, params, body }) =>
      checks.attach(user, params.id, body.followUpId),
    ),
  );
  router.get(
    '/skimmer-fit',
    ...endpoint({ action: 'tools.use', query: SkimmerFitQuery }, ({ user, query }) => skimmerFit(dataSource, user, query.siteId)),
  );
  router.get(
    '/application-sheets',
    ...endpoint({ action: 'oil-log.read', query: ApplicationSheetQuery }, ({ user, query }) => sheets.history(user, query.equipmentId)),
  );
  router.post(
    '/application-sheets',
    ...endpoint({ action: 'tools.use', body: SaveApplicationSheetRequest, status: 201 }, ({ user, body }) => sheets.save(user, body)),
  );
  router.get(
    '/application-sheets/:id/sheet.pdf',
    ...endpoint({ action: 'oil-log.read', params: IdParams }, async ({ user, params, res }) =>
      sendDownload(res, await sheets.pdf(user, params.id)),
    ),
  );
  return router;
}
