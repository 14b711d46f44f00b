import { can } from '../../contracts/permissions.js';
import { Router } from 'express';
import type { DataSource, EntityManager } from 'typeorm';
import { z } from 'zod';
import { CreateShipmentRequest, ShipmentQuery, UpdateShipmentRequest, type ShipmentView } from '../../contracts/shipments.js';
import { currentUser, type CurrentUser } from '../../auth/current-user.js';
import { assertSiteAllowed, assertSiteVisible } from '../../auth/site-access.js';
import { insertRow, uniquely, updateRow } from '../../db/rows.js';
import { usedOilFlags } from '../../domain/used-oil.js';
import { convert } from '../../domain/units.js';
import { forbidden, invalid, notFound } from '../../errors/app-error.js';
import { requirePermission } from '../../middleware/require-permission.js';
import { singleUpload } from '../../middleware/upload.js';
import { validate } from '../../middleware/validate.js';
import { checkUpload, sendStoredFile, storeFile } from '../files/stored-files.js';
import { siteToday } from '../site-today.js';
import { recordTrail } from '../trail/trail.js';
import { findShipment, pageShipments } from './shipments.repository.js';

const IdParams = z.object({ id: z.uuid('Not a valid id') });
const FileParams = IdParams.extend({ fileId: z.uuid('Not a valid id') });
const scanTypes = ['application/pdf', 'image/jpeg', 'image/png', 'image/webp', 'image/tiff'];
const duplicate = 'This site already recorded a shipment with this document';

type ShipmentBody = Partial<z.infer<typeof CreateShipmentRequest>>;

/** Columns of a shipment as written: canonical litres and the 279 flags come from the same body. */
function columns(merged: Required<Omit<ShipmentBody, 'siteId'>>, changes: ShipmentBody): Record<string, unknown> {
  const flags = usedOilFlags(merged);
  const written: Record<string, unknown> = { ...changes, quantityLitres: convert(merged.quantity, merged.quantityUnit, 'L'), flags: JSON.stringify(flags) };
  delete written.siteId;
  return written;
}

/** Once the signed copy is in, the papers are the coordinator's to change. */
function assertMayChange(user: CurrentUser, shipment: ShipmentView): void {
  if (shipment.signedCopyReceivedOn && !can(user.role, 'shipments.change-after-signed-copy')) {
    throw forbidden('The signed copy is in: only a coordinator can change this shipment now');
  }
}

async function visibleShipment(db: DataSource | EntityManager, user: CurrentUser, id: string): Promise<ShipmentView> {
  const shipment = await findShipment(db, id);
  assertSiteVisible(user, shipment?.siteId, 'Shipment');
  return shipment!;
}

export function shipmentsRoutes(dataSource: DataSource): Router {
  const router = Router();

  router.get('/', requirePermission('shipments.read'), validate({ query: ShipmentQuery }), async (_req, res) => {
    const user = currentUser(res);
    const { siteId } = res.locals.query;
    if (siteId) assertSiteAllowed(user, siteId);
    res.json(await pageShipments(dataSource, siteId ? [siteId] : user.siteIds, res.locals.query));
  });

  router.get('/:id', requirePermission('shipments.read'), validate({ params: IdParams }), async (_req, res) => {
    res.json(await visibleShipment(dataSource, currentUser(res), res.locals.params.id));
  });

  router.post('/', requirePermission('shipments.write'), validate({ body: CreateShipmentRequest }), async (_req, res) => {
    const user = currentUser(res);
    const body = res.locals.body as z.infer<typeof CreateShipmentRequest>;
    assertSiteAllowed(user, body.siteId);
    const created = await uniquely(() => dataSource.transaction(async (manager) => {
      const today = await siteToday(manager, body.siteId);
      if (body.shippedOn > today) throw invalid({ shippedOn: 'Cannot be in the future' });
      if (body.signedCopyReceivedOn && body.signedCopyReceivedOn > today) throw invalid({ signedCopyReceivedOn: 'Cannot be in the future' });
      const row = await insertRow(manager, 'shipment', { siteId: body.siteId, ...columns(body as never, body), createdBy: user.id });
      const after = (await findShipment(manager, row.id as string))!;
      await recordTrail(manager, user, { action: 'create', entity: 'shipment', entityId: after.id, siteId: body.siteId, after });
      return after;
    }), 'documentNumber', duplicate);
    res.status(201).json(created);
  });

  router.patch('/:id', requirePermission('shipments.write'), validate({ params: IdParams, body: UpdateShipmentRequest }), async (_req, res) => {
    const user = currentUser(res);
    const updated = await uniquely(() => dataSource.transaction(async (manager) => {
      const before = await visibleShipment(manager, user, res.locals.params.id);
      assertMayChange(user, before);
      const changes = res.locals.body as ShipmentBody;
      const merged = { ...before, ...changes };
      if (merged.signedCopyReceivedOn && merged.signedCopyReceivedOn < merged.shippedOn) {
        throw invalid({ signedCopyReceivedOn: 'Cannot come back before the shipment left' });
      }
      if (merged.signedCopyReceivedOn && merged.signedCopyReceivedOn > (await siteToday(manager, before.siteId))) {
        throw invalid({ signedCopyReceivedOn: 'Cannot be in the future' });
      }
      await updateRow(manager, 'shipment', before.id, columns(merged as never, changes));
      const after = (await findShipment(manager, before.id))!;
      await recordTrail(manager, user, { action: 'update', entity: 'shipment', entityId: before.id, siteId: before.siteId, before, after });
      return after;
    }), 'documentNumber', duplicate);
    res.json(updated);
  });

  router.post('/:id/files', requirePermission('shipments.write'), validate({ params: IdParams }), singleUpload(), async (req, res) => {
    const user = currentUser(res);
    const { mediaType } = await checkUpload(req.file, scanTypes);
    const after = await dataSource.transaction(async (manager) => {
      const before = await visibleShipment(manager, user, res.locals.params.id);
      assertMayChange(user, before);
      const stored = await storeFile(manager, req.file!, mediaType, user.id);
      await manager.query('INSERT INTO shipment_file (shipment_id, file_id) VALUES ($1, $2)', [before.id, stored.id]);
      await recordTrail(manager, user, { action: 'attach-file', entity: 'shipment', entityId: before.id, siteId: before.siteId, after: stored });
      return (await findShipment(manager, before.id))!;
    });
    res.status(201).json(after);
  });

  router.get('/:id/files/:fileId', requirePermission('shipments.read'), validate({ params: FileParams }), async (_req, res) => {
    const shipment = await visibleShipment(dataSource, currentUser(res), res.locals.params.id);
    if (!shipment.files.some((file) => file.id === res.locals.params.fileId)) throw notFound('Scan');
    await sendStoredFile(dataSource.manager, res.locals.params.fileId, res, true);
  });

  return router;
}
