import { Router } from 'express';
import { DateTime } from 'luxon';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { UpkeepCheckRequest, upkeepItems, type UpkeepCheckView } from '../../contracts/oil.js';
import { currentUser } from '../../auth/current-user.js';
import { assertSiteVisible } from '../../auth/site-access.js';
import { invalid } from '../../errors/app-error.js';
import { requirePermission } from '../../middleware/require-permission.js';
import { singleUpload } from '../../middleware/upload.js';
import { validate } from '../../middleware/validate.js';
import { checkUpload, sendStoredFile, storeFile } from '../files/stored-files.js';
import { openFollowUp } from '../follow-ups/open-follow-up.js';
import { siteToday } from '../site-today.js';
import { recordTrail } from '../trail/trail.js';

const ListQuery = z.object({ equipmentId: z.uuid('Not a valid id') });
const photoTypes = ['image/jpeg', 'image/png', 'image/webp', 'image/heic'];

function view(row: Record<string, any>): UpkeepCheckView {
  return {
    id: row.id, equipmentId: row.equipment_id, siteId: row.site_id, checkedOn: row.checked_on, items: row.items,
    immersionValue: row.immersion_value === null ? null : Number(row.immersion_value), immersionUnit: row.immersion_unit,
    failedCount: row.failed_count, checkedByName: row.checked_by_name,
  };
}

/** Dated checklists per piece of equipment; a failed item opens a follow-up. */
export function upkeepChecksRoutes(dataSource: DataSource): Router {
  const router = Router();

  router.get('/', requirePermission('oil-log.read'), validate({ query: ListQuery }), async (_req, res) => {
    const [equipment] = await dataSource.query('SELECT site_id FROM equipment WHERE id = $1', [res.locals.query.equipmentId]);
    assertSiteVisible(currentUser(res), equipment?.site_id, 'Equipment');
    const rows = await dataSource.query(
      `SELECT c.*, u.name AS checked_by_name FROM upkeep_check c JOIN app_user u ON u.id = c.checked_by
        WHERE c.equipment_id = $1 ORDER BY c.checked_on DESC, c.created_at DESC LIMIT 200`,
      [res.locals.query.equipmentId],
    );
    res.json({ items: rows.map(view), checklist: upkeepItems });
  });

  // A photo is uploaded first, then named by the check's item (photoFileId).
  router.post('/photos', requirePermission('oil-log.write'), singleUpload(), async (req, res) => {
    const { mediaType } = await checkUpload(req.file, photoTypes);
    const stored = await dataSource.transaction((manager) => storeFile(manager, req.file!, mediaType, currentUser(res).id));
    res.status(201).json(stored);
  });

  router.get('/photos/:fileId', requirePermission('oil-log.read'), validate({ params: z.object({ fileId: z.uuid() }) }), async (_req, res) => {
    const [owner] = await dataSource.query(
      `SELECT c.site_id FROM upkeep_check c, jsonb_array_elements(c.items) item WHERE item->>'photoFileId' = $1 LIMIT 1`,
      [res.locals.params.fileId],
    );
    assertSiteVisible(currentUser(res), owner?.site_id, 'Photo');
    await sendStoredFile(dataSource.manager, res.locals.params.fileId, res, true);
  });

  router.post('/', requirePermission('oil-log.write'), validate({ body: UpkeepCheckRequest }), async (_req, res) => {
    const user = currentUser(res);
    const body = res.locals.body as z.infer<typeof UpkeepCheckRequest>;
    const created = await dataSource.transaction(async (manager) => {
      const [equipment] = await manager.query('SELECT id, site_id, name FROM equipment WHERE id = $1', [body.equipmentId]);
      if (!equipment || !user.siteIds.includes(equipment.site_id)) throw invalid({ equipmentId: 'No such equipment at your sites' });
      if (body.checkedOn > (await siteToday(manager, equipment.site_id))) throw invalid({ checkedOn: 'Cannot be in the future' });
      const photoIds = body.items.map((item) => item.photoFileId).filter((id): id is string => id !== null);
      if (photoIds.length > 0) {
        const found = await manager.query('SELECT count(*)::int AS n FROM stored_file WHERE id = ANY($1::uuid[])', [photoIds]);
        if (found[0].n !== new Set(photoIds).size) throw invalid({ items: 'A photo was not found; upload it first' });
      }
      const failed = body.items.filter((item) => item.outcome === 'fail');
      const [row] = await manager.query(
        `INSERT INTO upkeep_check (equipment_id, site_id, checked_on, items, immersion_value, immersion_unit, failed_count, checked_by)
         VALUES ($1, $2, $3, $4, $5, $6, $7, $8) RETURNING *`,
        [equipment.id, equipment.site_id, body.checkedOn, JSON.stringify(body.items), body.immersionValue, body.immersionUnit, failed.length, user.id],
      );
      if (failed.length > 0) {
        const labels = failed.map((item) => upkeepItems.find((known) => known.key === item.key)!.label.toLowerCase());
        await openFollowUp(manager, {
          siteId: equipment.site_id, kind: 'upkeep-failed', sourceEntity: 'upkeep-check', sourceId: row.id,
          title: `Fix ${equipment.name}: ${labels.join('; ')}`,
          dueAt: DateTime.fromISO(body.checkedOn).plus({ days: 7 }).toJSDate(),
        });
      }
      const after = view({ ...row, checked_by_name: user.name });
      await recordTrail(manager, user, { action: 'create', entity: 'upkeep-check', entityId: row.id, siteId: equipment.site_id, after });
      return after;
    });
    res.status(201).json(created);
  });

  return router;
}
