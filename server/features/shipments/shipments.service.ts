import type { Response } from 'express';
import type { DataSource, EntityManager } from 'typeorm';
import { can, CORRECTION_WINDOW_MS } from '../../contracts/permissions.js';
import type { CreateShipmentRequest, ShipmentQuery, ShipmentView, UpdateShipmentRequest } from '../../contracts/shipments.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteAllowed, assertSiteVisible } from '../../auth/site-access.js';
import { uniquely } from '../../db/uniquely.js';
import { convert } from '../../domain/units.js';
import { usedOilFlags } from '../../domain/used-oil.js';
import { forbidden, invalid, notFound } from '../../errors/app-error.js';
import { checkUpload, sendStoredFile, storeFile } from '../../kernel/files/stored-files.js';
import { siteToday } from '../../kernel/site-today.js';
import { closeResolvedFollowUps } from '../follow-ups/close-resolved.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { attachShipmentFile, findShipment, insertShipment, pageShipments, updateShipment } from './shipments.repository.js';

const scanTypes = ['application/pdf', 'image/jpeg', 'image/png', 'image/webp', 'image/tiff'];
const duplicate = 'This site already recorded a shipment with this document';

type ShipmentBody = Partial<CreateShipmentRequest>;

/** Columns of a shipment as written: canonical litres and the 279 flags come from the same body. */
function columns(merged: Required<Omit<ShipmentBody, 'siteId'>>, changes: ShipmentBody) {
  const { siteId: _siteId, ...written } = changes;
  return { ...written, quantityLitres: convert(merged.quantity, merged.quantityUnit, 'L')!, flags: usedOilFlags(merged) };
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

/** The signed copy is back: the follow-ups that chased it (40 CFR 262.42) close by themselves. */
async function closeWhenSignedCopyBack(manager: EntityManager, user: CurrentUser, shipment: ShipmentView): Promise<void> {
  if (!shipment.signedCopyReceivedOn) return;
  await closeResolvedFollowUps(manager, user, {
    siteId: shipment.siteId,
    kinds: ['contact-transporter-and-facility', 'exception-report', 'copy-with-note-of-non-receipt'],
    sourceEntity: 'shipment',
    sourceIds: [shipment.id],
    resolvedBy: { entity: 'shipment', id: shipment.id },
    note: `the signed copy of ${shipment.documentNumber} was recorded as received on ${shipment.signedCopyReceivedOn}`,
  });
}

/** Oil and oily waste leaving a site, with its manifest or bill of lading and the scans of its papers. */
export class ShipmentsService {
  constructor(private readonly dataSource: DataSource) {}

  list(user: CurrentUser, query: ShipmentQuery) {
    if (query.siteId) assertSiteAllowed(user, query.siteId);
    return pageShipments(this.dataSource, query.siteId ? [query.siteId] : user.siteIds, query);
  }

  get(user: CurrentUser, id: string): Promise<ShipmentView> {
    return visibleShipment(this.dataSource, user, id);
  }

  create(user: CurrentUser, request: CreateShipmentRequest): Promise<ShipmentView> {
    assertSiteAllowed(user, request.siteId);
    return uniquely(
      () =>
        this.dataSource.transaction(async (manager) => {
          const today = await siteToday(manager, request.siteId);
          if (request.shippedOn > today) throw invalid({ shippedOn: 'Cannot be in the future' });
          if (request.signedCopyReceivedOn && request.signedCopyReceivedOn > today)
            throw invalid({ signedCopyReceivedOn: 'Cannot be in the future' });
          const id = await insertShipment(manager, { siteId: request.siteId, ...columns(request as never, request), createdBy: user.id });
          const after = (await findShipment(manager, id))!;
          await recordTrail(manager, user, { action: 'create', entity: 'shipment', entityId: after.id, siteId: request.siteId, after });
          await closeWhenSignedCopyBack(manager, user, after);
          return after;
        }),
      'documentNumber',
      duplicate,
    );
  }

  update(user: CurrentUser, id: string, changes: UpdateShipmentRequest): Promise<ShipmentView> {
    return uniquely(
      () =>
        this.dataSource.transaction(async (manager) => {
          const before = await visibleShipment(manager, user, id);
          assertMayChange(user, before);
          const { reason, ...fields } = changes;
          const corrects = Object.entries(fields).some(
            ([key, value]) => key !== 'signedCopyReceivedOn' && value !== undefined && value !== before[key as keyof ShipmentView],
          );
          if (corrects && !reason && Date.now() - new Date(before.enteredAt).getTime() > CORRECTION_WINDOW_MS) {
            throw invalid({ reason: 'Entered more than 24 hours ago: say why it is corrected' });
          }
          const merged = { ...before, ...fields };
          if (merged.signedCopyReceivedOn && merged.signedCopyReceivedOn < merged.shippedOn) {
            throw invalid({ signedCopyReceivedOn: 'Cannot come back before the shipment left' });
          }
          if (merged.signedCopyReceivedOn && merged.signedCopyReceivedOn > (await siteToday(manager, before.siteId))) {
            throw invalid({ signedCopyReceivedOn: 'Cannot be in the future' });
          }
          await updateShipment(manager, before.id, columns(merged as never, fields as ShipmentBody));
          const after = (await findShipment(manager, before.id))!;
          await recordTrail(manager, user, {
            action: 'update',
            entity: 'shipment',
            entityId: before.id,
            siteId: before.siteId,
            before,
            after: { ...after, reason },
          });
          if (!before.signedCopyReceivedOn) await closeWhenSignedCopyBack(manager, user, after);
          return after;
        }),
      'documentNumber',
      duplicate,
    );
  }

  async attachScan(user: CurrentUser, id: string, file: Express.Multer.File | undefined): Promise<ShipmentView> {
    const { mediaType } = await checkUpload(file, scanTypes);
    return this.dataSource.transaction(async (manager) => {
      const before = await visibleShipment(manager, user, id);
      assertMayChange(user, before);
      const stored = await storeFile(manager, file!, mediaType, {
        userId: user.id,
        siteId: before.siteId,
        purpose: 'signed-copy',
        owner: { entity: 'shipment', id: before.id },
      });
      await attachShipmentFile(manager, before.id, stored.id);
      await recordTrail(manager, user, {
        action: 'attach-file',
        entity: 'shipment',
        entityId: before.id,
        siteId: before.siteId,
        after: stored,
      });
      return (await findShipment(manager, before.id))!;
    });
  }

  async sendScan(user: CurrentUser, id: string, fileId: string, res: Response): Promise<void> {
    const shipment = await visibleShipment(this.dataSource, user, id);
    if (!shipment.files.some((file) => file.id === fileId)) throw notFound('Scan');
    await sendStoredFile(this.dataSource.manager, fileId, res, true);
  }
}
