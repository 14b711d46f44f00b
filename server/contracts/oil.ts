import { z } from 'zod';
import type { Flag } from './flags.js';
import { isoDate, updateOf, uuid } from './fields.js';
import { sortedPageQuery } from './paging.js';

export const equipmentKinds = [
  'belt-skimmer',
  'drum-skimmer',
  'disc-skimmer',
  'tube-skimmer',
  'mop-skimmer',
  'oil-water-separator',
  'sump',
] as const;

export const equipmentKindLabels: Record<(typeof equipmentKinds)[number], string> = {
  'belt-skimmer': 'Belt skimmer',
  'drum-skimmer': 'Drum skimmer',
  'disc-skimmer': 'Disc skimmer',
  'tube-skimmer': 'Tube skimmer',
  'mop-skimmer': 'Mop skimmer',
  'oil-water-separator': 'Oil-water separator',
  sump: 'Sump',
};

export const EquipmentFields = z.object({
  siteId: uuid,
  name: z.string().trim().min(1, 'Enter a name').max(120),
  kind: z.enum(equipmentKinds),
  serves: z.string().trim().max(200).default(''),
  ratedCapacity: z.number().finite().positive('Above zero').max(100_000),
  ratedUnit: z.enum(['gal/h', 'L/h']),
  mediumMaterial: z.string().trim().max(80).nullable().default(null),
  upkeepIntervalDays: z.number().int().min(1).max(366),
  /** Lube oils are about 0.85–0.90; 0.88 is Decant's default. */
  specificGravity: z.number().gt(0.5).lt(1.2).default(0.88),
  /** The discharge point whose water passes through it, if any. */
  dischargePointId: uuid.nullable().default(null),
  active: z.boolean().default(true),
});
export const CreateEquipmentRequest = EquipmentFields;
export const UpdateEquipmentRequest = updateOf(EquipmentFields.omit({ siteId: true }));

export interface EquipmentView extends z.infer<typeof EquipmentFields> {
  id: string;
  ratedLitresPerHour: number;
  lastCheckedOn: string | null;
  nextCheckDueOn: string | null;
  upkeepOverdue: boolean;
  averageLitresPerHour: number | null;
  likelyUndersized: boolean;
  collectedLitresLast30Days: number;
}

export const observations = ['free-oil', 'sheen', 'emulsified-oil', 'debris'] as const;
/** What the operator saw, in words. */
export const observationWords: Record<(typeof observations)[number], string> = {
  'free-oil': 'Free oil',
  sheen: 'Sheen',
  'emulsified-oil': 'Emulsified oil',
  debris: 'Debris',
};

export const OilLogFields = z.object({
  equipmentId: uuid,
  collectedOn: isoDate,
  volume: z
    .number({ error: 'Enter the oil collected' })
    .finite()
    .min(0, 'Cannot be negative: enter the oil collected')
    .max(1_000_000, 'Not a plausible volume for one day'),
  unit: z.enum(['gal', 'L']),
  hoursRun: z.number().finite().min(0).max(24, 'A day has 24 hours').nullable().default(null),
  waterTemperatureC: z
    .number()
    .finite()
    .min(-5, 'Water colder than -5 °C (23 °F) is not plausible')
    .max(100, 'Water hotter than 100 °C (212 °F) is not plausible')
    .nullable()
    .default(null),
  observations: z.array(z.enum(observations)).max(4).default([]),
  note: z.string().trim().max(1000).default(''),
});
export const CreateOilLogRequest = OilLogFields;
export const UpdateOilLogRequest = updateOf(OilLogFields.omit({ equipmentId: true })).extend({
  /** Required from a coordinator correcting someone's entry after 24 hours. */
  reason: z.string().trim().min(3).max(500).optional(),
});

export interface OilLogEntryView {
  id: string;
  equipmentId: string;
  equipmentName: string;
  siteId: string;
  collectedOn: string;
  volumeLitres: number;
  enteredVolume: number;
  enteredUnit: 'gal' | 'L';
  hoursRun: number | null;
  waterTemperatureC: number | null;
  observations: string[];
  note: string;
  flags: Flag[];
  enteredBy: string;
  enteredByName: string;
  createdAt: string;
}

export const oilLogSortKeys = ['collectedOn', 'volumeLitres', 'equipmentName'] as const;
export const OilLogQuery = sortedPageQuery(oilLogSortKeys).extend({
  siteId: uuid.optional(),
  equipmentId: uuid.optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
});

export const OilTotalsQuery = z.object({
  siteId: uuid,
  equipmentId: uuid.optional(),
  by: z.enum(['day', 'week', 'month']).default('month'),
  from: isoDate.optional(),
  to: isoDate.optional(),
});

export const UpkeepCheckRequest = z.object({
  equipmentId: uuid,
  checkedOn: isoDate,
  items: z
    .array(
      z.object({
        key: z.string().trim().min(1).max(40),
        outcome: z.enum(['pass', 'fail', 'not-applicable']),
        note: z.string().trim().max(500).default(''),
        photoFileId: uuid.nullable().default(null),
      }),
    )
    .min(1, 'Answer each item of the checklist')
    .max(20)
    .refine((items) => new Set(items.map((item) => item.key)).size === items.length, 'Each item once'),
  immersionValue: z.number().finite().min(0).max(500).nullable().default(null),
  immersionUnit: z.enum(['in', 'cm']).nullable().default(null),
});

export interface UpkeepCheckView extends z.infer<typeof UpkeepCheckRequest> {
  id: string;
  siteId: string;
  failedCount: number;
  checkedByName: string;
}

export type CreateEquipmentRequest = z.output<typeof CreateEquipmentRequest>;
export type UpdateEquipmentRequest = z.output<typeof UpdateEquipmentRequest>;
export type CreateOilLogRequest = z.output<typeof CreateOilLogRequest>;
export type UpdateOilLogRequest = z.output<typeof UpdateOilLogRequest>;
export type OilLogQuery = z.output<typeof OilLogQuery>;
export type OilTotalsQuery = z.output<typeof OilTotalsQuery>;
export type UpkeepCheckRequest = z.output<typeof UpkeepCheckRequest>;

/** The oil a site held when it began keeping its oil log in Decant. */
export const OpeningBalanceRequest = z.object({
  volume: z.number().finite().min(0).max(10_000_000),
  unit: z.enum(['gal', 'L']),
  on: isoDate,
});
export type OpeningBalanceRequest = z.output<typeof OpeningBalanceRequest>;

export const UpkeepCheckListQuery = z.object({ equipmentId: uuid });
/** The form fields beside an upkeep photo: the site it is taken at. */
export const PhotoUploadFields = z.object({ siteId: uuid });
export type UpkeepCheckListQuery = z.output<typeof UpkeepCheckListQuery>;

/** Oil on hand at a site: opening balance + collected − shipped since, against its storage capacity. */
export interface OilOnHandView {
  openingLitres: number;
  openingOn: string | null;
  collectedLitres: number;
  shippedLitres: number;
  capacityGallons: number | null;
  onHandLitres: number;
  flags: Flag[];
}
