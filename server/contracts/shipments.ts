import { z } from 'zod';
import type { Flag } from './flags.js';
import { isoDate, updateOf, uuid } from './fields.js';
import { EPA_ID_NUMBER, MANIFEST_TRACKING_NUMBER } from './manifest-formats.js';
import { sortedPageQuery } from './paging.js';

const epaId = z.string().trim().toUpperCase().regex(EPA_ID_NUMBER, '12 characters: 2 letters, then letters or digits');
const ppm = z.number().finite().min(0).max(1_000_000).nullable().default(null);

export const ShipmentFields = z.object({
  siteId: uuid,
  shippedOn: isoDate,
  documentKind: z.enum(['hazardous-waste-manifest', 'used-oil-bill-of-lading', 'non-hazardous-manifest']),
  documentNumber: z.string().trim().toUpperCase().min(1, 'Enter the document number').max(40),
  transporterName: z.string().trim().min(1, 'Enter the transporter').max(200),
  transporterEpaId: epaId,
  receiverName: z.string().trim().min(1, 'Enter the receiving facility').max(200),
  receiverEpaId: epaId,
  wasteDescription: z.string().trim().min(1, 'Describe the waste').max(300),
  quantity: z.number().finite().positive('Above zero').max(1_000_000),
  quantityUnit: z.enum(['gal', 'L']),
  totalHalogensPpm: ppm,
  burnedAsFuel: z.boolean().default(false),
  arsenicPpm: ppm,
  cadmiumPpm: ppm,
  chromiumPpm: ppm,
  leadPpm: ppm,
  flashPointF: z.number().finite().min(-100).max(1000).nullable().default(null),
  signedCopyReceivedOn: isoDate.nullable().default(null),
});

type ShipmentShape = { documentKind?: string; documentNumber?: string; shippedOn?: string; signedCopyReceivedOn?: string | null };
const manifestNumber = (shipment: ShipmentShape) =>
  shipment.documentKind !== 'hazardous-waste-manifest' ||
  !shipment.documentNumber ||
  MANIFEST_TRACKING_NUMBER.test(shipment.documentNumber);
const copyAfterShipment = (shipment: ShipmentShape) =>
  !shipment.signedCopyReceivedOn || !shipment.shippedOn || shipment.signedCopyReceivedOn >= shipment.shippedOn;

export const CreateShipmentRequest = ShipmentFields.refine(manifestNumber, {
  path: ['documentNumber'],
  message: 'A manifest tracking number is 9 digits then 3 letters',
}).refine(copyAfterShipment, { path: ['signedCopyReceivedOn'], message: 'Cannot come back before the shipment left' });
/** A correction (anything but the signed copy's return) after the first 24 hours says why; the trail keeps the reason. */
export const UpdateShipmentRequest = updateOf(ShipmentFields.omit({ siteId: true }))
  .extend({ reason: z.string().trim().max(500).nullable().default(null) })
  .refine(manifestNumber, { path: ['documentNumber'], message: 'A manifest tracking number is 9 digits then 3 letters' })
  .refine(copyAfterShipment, { path: ['signedCopyReceivedOn'], message: 'Cannot come back before the shipment left' });
export type CreateShipmentRequest = z.infer<typeof CreateShipmentRequest>;

/** `not-tracked`: papers other than a hazardous waste manifest, which 40 CFR 262.42's signed-copy deadlines do not cover. */
export const shipmentStatuses = ['awaiting-signed-copy', 'overdue', 'complete', 'not-tracked'] as const;
export const shipmentSortKeys = ['shippedOn', 'documentNumber', 'quantityLitres'] as const;
export const ShipmentQuery = sortedPageQuery(shipmentSortKeys).extend({
  siteId: uuid.optional(),
  status: z.enum(shipmentStatuses).optional(),
});

export interface ShipmentDeadlineView {
  step: string;
  days: number;
  dueOn: string;
  daysLeft: number;
  source: string;
}

export interface ShipmentView extends Omit<z.infer<typeof ShipmentFields>, never> {
  id: string;
  quantityLitres: number;
  status: (typeof shipmentStatuses)[number];
  /** When it was entered: corrections after the first 24 hours need a reason. */
  enteredAt: string;
  deadlines: ShipmentDeadlineView[];
  flags: Flag[];
  files: Array<{ id: string; fileName: string; mediaType: string; sizeBytes: number; sha256: string }>;
}

export type UpdateShipmentRequest = z.output<typeof UpdateShipmentRequest>;
export type ShipmentQuery = z.output<typeof ShipmentQuery>;
