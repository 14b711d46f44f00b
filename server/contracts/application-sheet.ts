import { z } from 'zod';
import { uuid } from './fields.js';

const positive = (what: string) =>
  z
    .number({ error: `Enter the ${what}` })
    .finite()
    .positive(`The ${what} must be more than 0`);
const atLeastZero = (what: string) =>
  z
    .number({ error: `Enter the ${what}` })
    .finite()
    .min(0, `The ${what} cannot be negative`);
const text = (max: number) => z.string().trim().max(max).default('');

export const oilKinds = ['tramp-hydraulic', 'cutting-oil', 'lubricant', 'food-oil', 'fuel', 'other'] as const;

/** The words the sheet's choices are shown and printed with. */
export const sheetWords = {
  shape: { rectangular: 'Rectangular', round: 'Round' },
  flowMode: { continuous: 'Continuous flow', batch: 'Batch (filled and emptied)' },
  oilKind: {
    'tramp-hydraulic': 'Tramp or hydraulic oil',
    'cutting-oil': 'Cutting oil or coolant',
    lubricant: 'Lubricants',
    'food-oil': 'Food oils and fats',
    fuel: 'Fuel oil or diesel',
    other: 'Other',
  },
  oilState: { free: 'Free oil', emulsified: 'Emulsified', both: 'Free and emulsified' },
  turbulence: { calm: 'Calm', moderate: 'Some movement', agitated: 'Agitated' },
  solids: { none: 'None', some: 'Some', heavy: 'Heavy (chips, sludge)' },
  supplyPhase: { single: 'Single phase', three: 'Three phase', none: 'No supply at the tank' },
  duty: { continuous: 'Continuous', timed: 'Timed' },
} as const;

/** The units each system enters the sheet in. */
export const sheetUnits = {
  metric: { length: 'm', flow: 'm³/h', temperature: '°C', load: 'L/day' },
  us: { length: 'ft', flow: 'US gal/min', temperature: '°F', load: 'US gal/day' },
} as const;

/**
 * What a person gathers about a tank, sump or separator before choosing or checking a skimmer,
 * in the units they work in: metric (m, m³/h, °C, L/day) or US (ft, US gal/min, °F, US gal/day).
 */
export const ApplicationSheetContent = z
  .object({
    unitSystem: z.enum(['metric', 'us']),
    shape: z.enum(['rectangular', 'round']),
    length: positive('length').nullable().default(null),
    width: positive('width').nullable().default(null),
    diameter: positive('diameter').nullable().default(null),
    tankDepth: positive('tank depth'),
    /** The depth of liquid at the usual working level. */
    workingLevel: positive('working level'),
    /** How far the level rises and falls around it, up and down together. */
    levelVariation: atLeastZero('level variation').default(0),
    flowMode: z.enum(['continuous', 'batch']),
    flowIn: atLeastZero('flow in').default(0),
    flowOut: atLeastZero('flow out').default(0),
    waterTemperatureMin: z.number({ error: 'Enter the lowest water temperature' }).finite(),
    waterTemperatureMax: z.number({ error: 'Enter the highest water temperature' }).finite(),
    phMin: z.number().finite().min(0, 'pH runs from 0 to 14').max(14, 'pH runs from 0 to 14').nullable().default(null),
    phMax: z.number().finite().min(0, 'pH runs from 0 to 14').max(14, 'pH runs from 0 to 14').nullable().default(null),
    oilKind: z.enum(oilKinds),
    oilSpecificGravity: z
      .number({ error: 'Enter the oil specific gravity' })
      .finite()
      .min(0.6, 'Below 0.6 is not an oil')
      .lt(1, 'An oil of specific gravity 1 or more does not float: a gravity tank or skimmer cannot take it off the surface'),
    oilState: z.enum(['free', 'emulsified', 'both']),
    /** L/day or US gal/day. */
    estimatedOilLoad: atLeastZero('estimated oil load').nullable().default(null),
    turbulence: z.enum(['calm', 'moderate', 'agitated']),
    solids: z.enum(['none', 'some', 'heavy']),
    chemicals: text(300),
    heated: z.boolean().default(false),
    inflowAt: text(200),
    oilGathersAt: text(200),
    /** Clear height above the tank's lip for the skimmer: m or ft. */
    headroom: atLeastZero('headroom').nullable().default(null),
    access: text(300),
    supplyVoltage: z.number().int().min(12, 'At least 12 V').max(690, 'At most 690 V').nullable().default(null),
    supplyPhase: z.enum(['single', 'three', 'none']),
    duty: z.enum(['continuous', 'timed']),
    dutyHoursPerDay: z.number().finite().gt(0, 'More than 0 h').max(24, 'A day has 24 hours').nullable().default(null),
    notes: text(2000),
  })
  .superRefine((sheet, ctx) => {
    const issue = (path: string, message: string) => ctx.addIssue({ code: 'custom', path: [path], message });
    if (sheet.shape === 'rectangular') {
      if (!sheet.length) issue('length', 'Enter the length');
      if (!sheet.width) issue('width', 'Enter the width');
    } else if (!sheet.diameter) issue('diameter', 'Enter the diameter');
    if (sheet.workingLevel > sheet.tankDepth) issue('workingLevel', 'The working level cannot be above the tank depth');
    if (sheet.workingLevel - sheet.levelVariation < 0 || sheet.workingLevel + sheet.levelVariation > sheet.tankDepth) {
      issue('levelVariation', 'The level would leave the tank: check the working level, the variation and the depth');
    }
    if (sheet.flowMode === 'continuous' && sheet.flowIn === 0) issue('flowIn', 'A continuous flow needs a flow in above 0');
    const us = sheet.unitSystem === 'us';
    const celsius = (value: number) => (us ? ((value - 32) * 5) / 9 : value);
    for (const [field, value] of [
      ['waterTemperatureMin', sheet.waterTemperatureMin],
      ['waterTemperatureMax', sheet.waterTemperatureMax],
    ] as const) {
      if (celsius(value) < 0 || celsius(value) > 100) issue(field, us ? 'Liquid water: 32 to 212 °F' : 'Liquid water: 0 to 100 °C');
    }
    if (sheet.waterTemperatureMin > sheet.waterTemperatureMax) issue('waterTemperatureMax', 'Below the lowest temperature');
    if (sheet.phMin !== null && sheet.phMax !== null && sheet.phMin > sheet.phMax) issue('phMax', 'Below the lowest pH');
    if (sheet.duty === 'timed' && sheet.dutyHoursPerDay === null) issue('dutyHoursPerDay', 'Enter the hours a day it runs');
  });
export type ApplicationSheetContent = z.output<typeof ApplicationSheetContent>;

export const SaveApplicationSheetRequest = z.object({
  equipmentId: uuid,
  content: ApplicationSheetContent,
  /** Why it changed; asked from the second version on. */
  reason: z.string().trim().max(500).default(''),
});
export type SaveApplicationSheetRequest = z.output<typeof SaveApplicationSheetRequest>;

export const ApplicationSheetQuery = z.object({ equipmentId: uuid });

export interface ApplicationSheetVersion {
  id: string;
  equipmentId: string;
  version: number;
  content: ApplicationSheetContent;
  /** Worked out from the dimensions, in the sheet's units. */
  computed: { surfaceArea: string; workingVolume: string; surfaceM2: number; workingVolumeM3: number };
  reason: string;
  savedByName: string;
  savedAt: string;
}

export interface ApplicationSheetHistory {
  current: ApplicationSheetVersion | null;
  versions: ApplicationSheetVersion[];
  caution: string;
}

/** What a printed sheet or a check says about the equipment: what it is, where, and what it is rated for. */
export interface EquipmentFacts {
  id: string;
  siteId: string;
  site: string;
  company: string;
  name: string;
  kind: string;
  serves: string;
  ratedCapacity: number;
  ratedUnit: 'gal/h' | 'L/h';
  mediumMaterial: string | null;
  pointCode: string | null;
}
