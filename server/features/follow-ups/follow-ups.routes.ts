import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { PageQuery } from '../../contracts/paging.js';
import { currentUser } from '../../auth/current-user.js';
import { assertSiteAllowed, assertSiteVisible } from '../../auth/site-access.js';
import { queryPage } from '../../db/page.js';
import { conflict, notFound } from '../../errors/app-error.js';
import { singleUpload } from '../../middleware/upload.js';
import { checkUpload, sendStoredFile, storeFile } from '../files/stored-files.js';
import { requirePermission } from '../../middleware/require-permission.js';
import { validate } from '../../middleware/validate.js';
import { recordTrail } from '../trail/trail.js';

const ListQuery = PageQuery.extend({ siteId: z.uuid('Not a valid id').optional(), status: z.enum(['open', 'done', 'done-late']).optional() });
const IdParams = z.object({ id: z.uuid('Not a valid id') });
const CloseRequest = z.object({ note: z.string().trim().min(3, 'Say how it was closed').max(2000) });

const view = (row: Record<string, any>) => ({
  id: row.id, siteId: row.site_id, kind: row.kind, sourceEntity: row.source_entity, sourceId: row.source_id, title: row.title,
  dueAt: row.due_at.toISOString(), status: row.status, closedAt: row.closed_at?.toISOString() ?? null, closingNote: row.closing_note,
  hasClosingFile: row.closing_file_id !== null,
});
const evidenceTypes = ['application/pdf', 'image/jpeg', 'image/png', 'image/webp'];

/** Follow-ups are opened by the server's rules; people close them, with a note, in the trail. */
export function followUpsRoutes(dataSource: DataSource): Router {
  const router = Router();

  router.get('/', requirePermission('follow-ups.read'), validate({ query: ListQuery }), async (_req, res) => {
    const user = currentUser(res);
    const query = res.locals.query as z.infer<typeof ListQuery>;
    if (query.siteId) assertSiteAllowed(user, query.siteId);
    res.json(await queryPage(dataSource, {
      select: 'SELECT * FROM follow_up',
      countFrom: 'FROM follow_up',
      where: `site_id = ANY($1::uuid[]) AND ($2::text IS NULL OR status = $2)`,
      order: `(status = 'open') DESC, due_at ${query.sortDesc ? 'DESC' : 'ASC'}`,
      params: [query.siteId ? [query.siteId] : user.siteIds, query.status ?? null],
    }, query, view));
  });

  // Closed with a note, and optionally a file (the notice sent, a lab report): JSON or multipart.
  router.post('/:id/close', requirePermission('follow-ups.close'), singleUpload(), validate({ params: IdParams, body: CloseRequest }), async (req, res) => {
    const user = currentUser(res);
    const checkedFile = req.file ? await checkUpload(req.file, evidenceTypes) : null;
    const closed = await dataSource.transaction(async (manager) => {
      const [before] = await manager.query('SELECT * FROM follow_up WHERE id = $1 FOR UPDATE', [res.locals.params.id]);
      assertSiteVisible(user, before?.site_id, 'Follow-up');
      if (before.status !== 'open') throw conflict('This follow-up is already closed');
      const stored = checkedFile ? await storeFile(manager, req.file!, checkedFile.mediaType, user.id) : null;
      // An UPDATE … RETURNING answers [rows, count] through TypeORM.
      const [[row]] = await manager.query(
        `UPDATE follow_up SET status = CASE WHEN now() > due_at THEN 'done-late' ELSE 'done' END, closed_at = now(), closing_note = $2, owner_id = $3,
           closing_file_id = $4 WHERE id = $1 RETURNING *`,
        [before.id, res.locals.body.note, user.id, stored?.id ?? null],
      );
      await recordTrail(manager, user, { action: 'close', entity: 'follow-up', entityId: row.id, siteId: row.site_id, before: view(before), after: view(row) });
      return view(row);
    });
    res.json(closed);
  });

  router.get('/:id/file', requirePermission('follow-ups.read'), validate({ params: IdParams }), async (_req, res) => {
    const [row] = await dataSource.query('SELECT site_id, closing_file_id FROM follow_up WHERE id = $1', [res.locals.params.id]);
    assertSiteVisible(currentUser(res), row?.site_id, 'Follow-up');
    if (!row.closing_file_id) throw notFound('File');
    await sendStoredFile(dataSource.manager, row.closing_file_id, res, true);
  });

  return router;
}
