import type { ApplicationSheetContent } from '../contracts/application-sheet.js';
import type { TankCheckRequest } from '../contracts/tools.js';
import { FOOT_METRES, US_GALLON_LITRES } from './units.js';

/** An application sheet in SI units, for the rules that read it. */
export interface SheetInSi {
  surfaceM2: number;
  workingDepthM: number;
  workingVolumeM3: number;
  levelVariationM: number;
  headroomM: number | null;
  flowInM3h: number;
  temperatureMinC: number;
  temperatureMaxC: number;
  /** Litres of oil a day, if estimated. */
  oilLoadLitresPerDay: number | null;
  /** Hours a day the skimmer runs: 24 when continuous. */
  runHoursPerDay: number;
}

export function sheetInSi(sheet: ApplicationSheetContent): SheetInSi {
  const us = sheet.unitSystem === 'us';
  const m = (value: number) => (us ? value * FOOT_METRES : value);
  const surfaceM2 = sheet.shape === 'rectangular' ? m(sheet.length!) * m(sheet.width!) : Math.PI * (m(sheet.diameter!) / 2) ** 2;
  const celsius = (value: number) => (us ? ((value - 32) * 5) / 9 : value);
  return {
    surfaceM2,
    workingDepthM: m(sheet.workingLevel),
    workingVolumeM3: surfaceM2 * m(sheet.workingLevel),
    levelVariationM: m(sheet.levelVariation),
    headroomM: sheet.headroom === null ? null : m(sheet.headroom),
    // US gal/min → m³/h; metric is entered in m³/h.
    flowInM3h: us ? (sheet.flowIn * US_GALLON_LITRES * 60) / 1000 : sheet.flowIn,
    temperatureMinC: celsius(sheet.waterTemperatureMin),
    temperatureMaxC: celsius(sheet.waterTemperatureMax),
    oilLoadLitresPerDay: sheet.estimatedOilLoad === null ? null : us ? sheet.estimatedOilLoad * US_GALLON_LITRES : sheet.estimatedOilLoad,
    runHoursPerDay: sheet.duty === 'timed' ? sheet.dutyHoursPerDay! : 24,
  };
}

/** The surface and the working volume, in the sheet's own units. */
export function sheetFigures(sheet: ApplicationSheetContent) {
  const si = sheetInSi(sheet);
  const us = sheet.unitSystem === 'us';
  const round = (value: number, digits: number) => value.toLocaleString('en-US', { maximumFractionDigits: digits });
  return {
    surfaceM2: si.surfaceM2,
    workingVolumeM3: si.workingVolumeM3,
    surfaceArea: us ? `${round(si.surfaceM2 / FOOT_METRES ** 2, 1)} ft²` : `${round(si.surfaceM2, 2)} m²`,
    workingVolume: us ? `${round((si.workingVolumeM3 * 1000) / US_GALLON_LITRES, 0)} US gal` : `${round(si.workingVolumeM3, 2)} m³`,
  };
}

/**
 * The tank check a sheet calls for, in the sheet's units: the working level as the depth the oil
 * rises through, the inflow, and the coldest water (the slowest rise, the safe side).
 */
export function tankCheckFromSheet(sheet: ApplicationSheetContent): TankCheckRequest {
  return {
    unitSystem: sheet.unitSystem,
    shape: sheet.shape,
    ...(sheet.shape === 'rectangular' ? { length: sheet.length!, width: sheet.width! } : { diameter: sheet.diameter! }),
    depth: sheet.workingLevel,
    flow: sheet.flowIn,
    waterTemperature: sheet.waterTemperatureMin,
    oilSpecificGravity: sheet.oilSpecificGravity,
    dropletMicrons: 150,
  };
}
