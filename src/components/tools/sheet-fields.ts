import { sheetWords, type sheetUnits, type ApplicationSheetContent } from '@contracts/application-sheet.js';

type Units = (typeof sheetUnits)[keyof typeof sheetUnits];
type Key = keyof ApplicationSheetContent;
/** A sheet being entered: any answer may still be missing. */
export type SheetDraft = Record<string, string | number | boolean | null>;

/** One input of the application sheet: how it is entered and labelled in the person's units. */
export interface SheetField {
  key: Key;
  label: (units: Units) => string;
  input: 'number' | 'text' | 'choice' | 'switch';
  choices?: Record<string, string>;
  hint?: string;
  /** Shown only when this answers true for the sheet being entered. */
  when?: (sheet: SheetDraft) => boolean;
  wide?: boolean;
}

const rectangular = (s: SheetDraft) => s.shape === 'rectangular';

/** The sheet's inputs in the order a person walks round a tank: the tank, the water, the oil, then power and duty. */
export const sheetGroups: Array<{ title: string; fields: SheetField[] }> = [
  {
    title: 'Tank or sump',
    fields: [
      { key: 'shape', label: () => 'Shape', input: 'choice', choices: sheetWords.shape },
      { key: 'length', label: (u) => `Length, ${u.length}`, input: 'number', when: rectangular },
      { key: 'width', label: (u) => `Width, ${u.length}`, input: 'number', when: rectangular },
      { key: 'diameter', label: (u) => `Diameter, ${u.length}`, input: 'number', when: (s) => s.shape === 'round' },
      { key: 'tankDepth', label: (u) => `Tank depth, ${u.length}`, input: 'number' },
      { key: 'workingLevel', label: (u) => `Working level (liquid depth), ${u.length}`, input: 'number' },
      { key: 'levelVariation', label: (u) => `Level rises and falls by ±, ${u.length}`, input: 'number' },
      { key: 'headroom', label: (u) => `Clear height above the lip, ${u.length}`, input: 'number' },
      { key: 'access', label: () => 'Access above the tank', input: 'text', wide: true },
    ],
  },
  {
    title: 'Water',
    fields: [
      { key: 'flowMode', label: () => 'Flow', input: 'choice', choices: sheetWords.flowMode },
      { key: 'flowIn', label: (u) => `Flow in, ${u.flow}`, input: 'number' },
      { key: 'flowOut', label: (u) => `Flow out, ${u.flow}`, input: 'number' },
      { key: 'waterTemperatureMin', label: (u) => `Lowest water temperature, ${u.temperature}`, input: 'number' },
      { key: 'waterTemperatureMax', label: (u) => `Highest water temperature, ${u.temperature}`, input: 'number' },
      { key: 'heated', label: () => 'The tank is heated', input: 'switch' },
      { key: 'phMin', label: () => 'Lowest pH', input: 'number' },
      { key: 'phMax', label: () => 'Highest pH', input: 'number' },
      { key: 'turbulence', label: () => 'Surface', input: 'choice', choices: sheetWords.turbulence },
      { key: 'solids', label: () => 'Debris and solids', input: 'choice', choices: sheetWords.solids },
      { key: 'chemicals', label: () => 'Chemicals or solvents present', input: 'text', wide: true },
      { key: 'inflowAt', label: () => 'Where the inflow enters', input: 'text', wide: true },
    ],
  },
  {
    title: 'Oil',
    fields: [
      { key: 'oilKind', label: () => 'Kind of oil', input: 'choice', choices: sheetWords.oilKind },
      {
        key: 'oilSpecificGravity',
        label: () => 'Oil specific gravity',
        input: 'number',
        hint: 'Tramp and hydraulic oil about 0.85–0.90; 1 or more does not float',
      },
      { key: 'oilState', label: () => 'Free or emulsified', input: 'choice', choices: sheetWords.oilState },
      { key: 'estimatedOilLoad', label: (u) => `Estimated oil load, ${u.load}`, input: 'number' },
      { key: 'oilGathersAt', label: () => 'Where the oil gathers', input: 'text', wide: true },
    ],
  },
  {
    title: 'Power and duty',
    fields: [
      { key: 'supplyVoltage', label: () => 'Supply voltage, V', input: 'number' },
      { key: 'supplyPhase', label: () => 'Supply', input: 'choice', choices: sheetWords.supplyPhase },
      { key: 'duty', label: () => 'Duty', input: 'choice', choices: sheetWords.duty },
      { key: 'dutyHoursPerDay', label: () => 'Hours a day it runs', input: 'number', when: (s) => s.duty === 'timed' },
      { key: 'notes', label: () => 'Notes', input: 'text', wide: true },
    ],
  },
];

/** A blank sheet in the person's units, with the answers most tanks share. */
export function blankSheet(unitSystem: 'metric' | 'us'): SheetDraft {
  return {
    unitSystem,
    shape: 'rectangular',
    length: null,
    width: null,
    diameter: null,
    tankDepth: null,
    workingLevel: null,
    levelVariation: 0,
    headroom: null,
    flowMode: 'continuous',
    flowIn: 0,
    flowOut: 0,
    waterTemperatureMin: null,
    waterTemperatureMax: null,
    phMin: null,
    phMax: null,
    oilKind: 'tramp-hydraulic',
    oilSpecificGravity: 0.87,
    oilState: 'free',
    estimatedOilLoad: null,
    turbulence: 'calm',
    solids: 'none',
    chemicals: '',
    heated: false,
    inflowAt: '',
    oilGathersAt: '',
    access: '',
    supplyVoltage: null,
    supplyPhase: 'single',
    duty: 'continuous',
    dutyHoursPerDay: null,
    notes: '',
  };
}
