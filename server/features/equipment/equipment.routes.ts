import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { CreateEquipmentRequest, UpdateEquipmentRequest } from '../../contracts/oil.js';
import { currentUser } from '../../auth/current-user.js';
import { assertSiteAllowed, assertSiteVisible } from '../../auth/site-access.js';
import { selectRow, uniquely, type Row } from '../../db/rows.js';
import { requirePermission } from '../../middleware/require-permission.js';
import { validate } from '../../middleware/validate.js';
import { siteToday } from '../site-today.js';
import { createTraced, deleteTraced, updateTraced } from '../trail/traced-writes.js';
import { findEquipment } from './equipment.repository.js';

const target = {
  table: 'equipment',
  entity: 'equipment',
  view: (row: Row) => ({ ...row, ratedCapacity: Number(row.ratedCapacity), specificGravity: Number(row.specificGravity) }),
  siteIdOf: (row: Row) => row.siteId as string,
};
const IdParams = z.object({ id: z.uuid('Not a valid id') });
const ListQuery = z.object({ siteId: z.uuid('Not a valid id') });
const duplicate = 'This site already has equipment with this name';

/** Skimmers, separators and sumps. Retired (inactive), never deleted while records refer to them. */
export function equipmentRoutes(dataSource: DataSource): Router {
  const router = Router();

  router.get('/', requirePermission('oil-log.read'), validate({ query: ListQuery }), async (_req, res) => {
    const { siteId } = res.locals.query;
    assertSiteAllowed(currentUser(res), siteId);
    res.json({ items: await findEquipment(dataSource, { siteIds: [siteId] }, await siteToday(dataSource, siteId)) });
  });

  router.get('/:id', requirePermission('oil-log.read'), validate({ params: IdParams }), async (_req, res) => {
    const row = await selectRow(dataSource.manager, 'equipment', res.locals.params.id);
    assertSiteVisible(currentUser(res), row?.siteId as string | undefined, 'Equipment');
    const [view] = await findEquipment(dataSource, { siteIds: [row!.siteId as string], id: row!.id as string }, await siteToday(dataSource, row!.siteId as string));
    res.json(view);
  });

  router.post('/', requirePermission('setup.manage'), validate({ body: CreateEquipmentRequest }), async (_req, res) => {
    assertSiteAllowed(currentUser(res), res.locals.body.siteId);
    res.status(201).json(await uniquely(() => createTraced(dataSource, currentUser(res), target, res.locals.body), 'name', duplicate));
  });

  router.patch('/:id', requirePermission('setup.manage'), validate({ params: IdParams, body: UpdateEquipmentRequest }), async (_req, res) => {
    const user = currentUser(res);
    const updated = await uniquely(
      () => updateTraced(dataSource, user, target, res.locals.params.id, res.locals.body, async (_m, before) => assertSiteVisible(user, before.siteId as string, 'Equipment')),
      'name',
      duplicate,
    );
    res.json(updated);
  });

  router.delete('/:id', requirePermission('setup.manage'), validate({ params: IdParams }), async (_req, res) => {
    const user = currentUser(res);
    await deleteTraced(dataSource, user, target, res.locals.params.id, async (_m, before) => assertSiteVisible(user, before.siteId as string, 'Equipment'));
    res.status(204).end();
  });

  return router;
}
