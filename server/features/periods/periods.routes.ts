import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { currentUser } from '../../auth/current-user.js';
import { assertSiteAllowed, assertSiteVisible } from '../../auth/site-access.js';
import { requirePermission } from '../../middleware/require-permission.js';
import { validate } from '../../middleware/validate.js';
import { isoDate } from '../../contracts/fields.js';
import { PeriodSummary } from '../../contracts/periods.js';
import { invalid } from '../../errors/app-error.js';
import { recordTrail } from '../trail/trail.js';
import { compileAndSave, findPeriod, listPeriods, summarise } from './periods.service.js';

const ListQuery = z.object({ siteId: z.uuid('Not a valid id').optional(), permitId: z.uuid('Not a valid id').optional() });
const IdParams = z.object({ id: z.uuid('Not a valid id') });
const SubmissionRequest = z.object({ submittedOn: isoDate });

export function periodsRoutes(dataSource: DataSource): Router {
  const router = Router();

  router.get('/', requirePermission('periods.read'), validate({ query: ListQuery }), async (_req, res) => {
    const user = currentUser(res);
    const { siteId, permitId } = res.locals.query as z.infer<typeof ListQuery>;
    if (siteId) assertSiteAllowed(user, siteId);
    const siteIds = siteId ? [siteId] : user.siteIds;
    res.json({ items: await listPeriods(dataSource, siteIds, permitId) });
  });

  router.get('/:id/summary', requirePermission('periods.read'), validate({ params: IdParams, response: PeriodSummary }), async (_req, res) => {
    const period = await findPeriod(dataSource, res.locals.params.id);
    assertSiteVisible(currentUser(res), period?.siteId, 'Period');
    res.json(await summarise(dataSource, period!));
  });

  router.post('/:id/compile', requirePermission('periods.compile'), validate({ params: IdParams, response: PeriodSummary }), async (_req, res) => {
    const period = await findPeriod(dataSource, res.locals.params.id);
    assertSiteVisible(currentUser(res), period?.siteId, 'Period');
    res.json(await compileAndSave(dataSource, currentUser(res), period!.id));
  });

  // Records when the periodic report went to the authority (signing and packs come later).
  router.put('/:id/submission', requirePermission('periods.compile'), validate({ params: IdParams, body: SubmissionRequest, response: PeriodSummary }), async (_req, res) => {
    const user = currentUser(res);
    const period = await findPeriod(dataSource, res.locals.params.id);
    assertSiteVisible(user, period?.siteId, 'Period');
    await dataSource.transaction(async (manager) => {
      if (res.locals.body.submittedOn < period!.endsOn) throw invalid({ submittedOn: 'Before the period ended' });
      if (res.locals.body.submittedOn > period!.today) throw invalid({ submittedOn: 'Cannot be in the future' });
      await manager.query('UPDATE reporting_period SET submitted_on = $2 WHERE id = $1', [period!.id, res.locals.body.submittedOn]);
      await recordTrail(manager, user, {
        action: 'record-submission', entity: 'reporting-period', entityId: period!.id, siteId: period!.siteId,
        before: { submittedOn: period!.submittedOn }, after: res.locals.body,
      });
    });
    res.json(await summarise(dataSource, (await findPeriod(dataSource, period!.id))!));
  });

  return router;
}
