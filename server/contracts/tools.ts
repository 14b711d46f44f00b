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
    recommendedLph: number | null;
    verdict: 'fits' | 'undersized' | 'no-log';
  }>;
  caution: string;
}
