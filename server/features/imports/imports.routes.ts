import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { ImportRunView } from '../../contracts/imports.js';
import { IdParams } from '../../contracts/params.js';
import { endpoint } from '../../http/endpoint.js';
import { notFound } from '../../errors/app-error.js';
import { findImportRun, importRunView } from '../../kernel/imports/import-runs.js';

/** Mounted at /api/import-runs: how an import is doing, for the person who started it. */
export function importRunsRoutes(dataSource: DataSource): Router {
  const router = Router();
  router.get(
    '/:id',
    ...endpoint({ action: 'signed-in', params: IdParams, response: ImportRunView }, async ({ user, params }) => {
      const run = await findImportRun(dataSource, params.id);
      // Another person's run is not found, not forbidden: its id tells nothing.
      if (!run || run.userId !== user.id) throw notFound('Import run');
      return importRunView(run);
    }),
  );
  return router;
}
