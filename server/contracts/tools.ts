import { z } from 'zod';

const positive = (what: string) =>
  z
    .number({ error: `Enter the ${what}` })
    .finite()
    .positive(`The ${what} must be more than 0`);

/** A tank check in the units the person works in. */
export const TankCheckRequest = z
  .object({
    unitSystem: z.enum(['metric', 'us']),
    shape: z.enum(['rectangular', 'round']),
    /** m or ft */
    length: positive('length').optional(),
    width: positive('width').optional(),
    diameter: positive('diameter').optional(),
    /** Working depth: m or ft */
    depth: positive('working depth'),
    /** m³/h or US gal/min */
    flow: positive('flow'),
    /** °C or °F */
    waterTemperature: z.number({ error: 'Enter the water temperature' }).finite(),
    oilSpecificGravity: z
      .number({ error: 'Enter the oil specific gravity' })
      .finite()
      .min(0.6, 'Below 0.6 is not an oil')
      .lt(1, 'An oil of specific gravity 1 or more does not float: a gravity tank or skimmer cannot take it off the surface'),
    dropletMicrons: z.number().finite().min(1, 'At least 1 µm').max(5000, 'At most 5,000 µm').default(150),
  })
  .superRefine((value, ctx) => {
    if (value.shape === 'rectangular') {
      if (!value.length) ctx.addIssue({ code: 'custom', path: ['length'], message: 'Enter the length' });
      if (!value.width) ctx.addIssue({ code: 'custom', path: ['width'], message: 'Enter the width' });
    } else if (!value.diameter) ctx.addIssue({ code: 'custom', path: ['diameter'], message: 'Enter the diameter' });
    const celsius = value.unitSystem === 'us' ? ((value.waterTemperature - 32) * 5) / 9 : value.waterTemperature;
    if (celsius < 0 || celsius > 80) {
      ctx.addIssue({
        code: 'custom',
        path: ['waterTemperature'],
        message: value.unitSystem === 'us' ? 'Use 32 to 176 °F' : 'Use 0 to 80 °C',
      });
    }
  });
export type TankCheckRequest = z.output<typeof TankCheckRequest>;

export interface TankCheckView {
  verdict: 'rises' | 'too-short' | 'oil-sinks';
  /** The verdict in a sentence, with the margin, in the person's units. */
  summary: string;
  /** What would change it, each on its own, in words. */
  remedies: string[];
  stokes: 'applies' | 'approximate' | 'does-not-apply';
  stokesNote: string;
  figures: Array<{ label: string; value: string }>;
  /** The estimate's limits and the engineer and codes it does not replace. */
  caution: string;
}

export const SkimmerFitQuery = z.object({ siteId: z.uuid('Not a valid id') });

export interface SkimmerFitView {
  /** Rate at least this many times the removal needed (common practice). */
  sizingFactor: number;
  items: Array<{
    equipmentId: string;
    name: string;
    kind: string;
    daysLogged: number;
    /** Median and highest day of the last 90, per hour run, L/h. */
    typicalLph: number | null;
    peakLph: number | null;
    ratedLph: number;
    /** The removal the sheet's estimated oil load asks for, per hour run, L/h; null without a sheet or an estimate. */
    sheetNeededLph: number | null;
    /** Which figure sized it: the larger of the log's peak and the sheet's estimate. */
    sizedFrom: 'oil-log' | 'sheet' | null;
    recommendedLph: number | null;
    verdict: 'fits' | 'undersized' | 'no-log';
    /** Version of the application sheet the notes read, or null without one. */
    sheetVersion: number | null;
    /** How the kind meets the tank, and what to watch for, each a short reason (common practice). */
    notes: Array<{ topic: string; weight: 'concern' | 'advice'; text: string }>;
  }>;
  caution: string;
}

/** A tank check kept as a dated record: for a piece of equipment, and as evidence of a follow-up. */
export const SaveTankCheckRequest = z.object({
  siteId: z.uuid('Not a valid id'),
  equipmentId: z.uuid('Not a valid id').nullable().default(null),
  followUpId: z.uuid('Not a valid id').nullable().default(null),
  input: TankCheckRequest,
});
export type SaveTankCheckRequest = z.output<typeof SaveTankCheckRequest>;

export const TankCheckListQuery = z
  .object({ equipmentId: z.uuid('Not a valid id').optional(), followUpId: z.uuid('Not a valid id').optional() })
  .refine((query) => query.equipmentId || query.followUpId, { message: 'Name the equipment or the follow-up', path: ['equipmentId'] });

export const AttachTankCheckRequest = z.object({ followUpId: z.uuid('Not a valid id') });

export interface SavedTankCheck {
  id: string;
  siteId: string;
  equipmentId: string | null;
  equipmentName: string | null;
  followUpId: string | null;
  followUpTitle: string | null;
  input: TankCheckRequest;
  result: TankCheckView;
  checkedByName: string;
  checkedAt: string;
}

/** Where a tank check starts from: a piece of equipment, or the equipment at the point of a follow-up's result. */
export const TankCheckStartQuery = z
  .object({ equipmentId: z.uuid('Not a valid id').optional(), followUpId: z.uuid('Not a valid id').optional() })
  .refine((query) => query.equipmentId || query.followUpId, { message: 'Name the equipment or the follow-up', path: ['equipmentId'] });

export interface TankCheckStart {
  siteId: string;
  followUp: { id: string; title: string; pointCode: string | null } | null;
  /** The equipment to check, each with the check its application sheet calls for (null without a sheet). */
  equipment: Array<{ id: string; name: string; kind: string; input: TankCheckRequest | null }>;
}
