import type { ApplicationSheetContent } from '../contracts/application-sheet.js';
import type { equipmentKinds } from '../contracts/oil.js';
import type { SheetInSi } from './application-sheet.js';
import { recommendedRating } from './oil-collection.js';
import { FOOT_METRES } from './units.js';

// Common practice of the trade, no published source: how the kind of skimmer meets the tank it
// serves. Each rule answers with one short reason. The equipment maker's guidance governs.

export type EquipmentKind = (typeof equipmentKinds)[number];

export interface FitNote {
  topic: 'reach' | 'level' | 'depth' | 'headroom' | 'materials' | 'emulsion' | 'coolant' | 'turbulence' | 'solids' | 'placement' | 'power';
  /** 'concern' when the condition works against this kind; 'advice' otherwise. */
  weight: 'concern' | 'advice';
  text: string;
}

/** Skimmers that pick up only where they meet the surface, at a fixed place. */
const fixedPickUp = (kind: EquipmentKind) => kind === 'belt-skimmer' || kind === 'disc-skimmer' || kind === 'drum-skimmer';
/** Skimmers whose medium floats out across the surface. */
const travelling = (kind: EquipmentKind) => kind === 'tube-skimmer' || kind === 'mop-skimmer';
const isGravity = (kind: EquipmentKind) => kind === 'oil-water-separator' || kind === 'sump';

/**
 * A surface larger than a fixed pick-up draws oil from by surface drift alone: above it, the oil
 * must be brought to the pick-up. Common practice, no published source (a working figure that
 * varies with the maker and the tank; treat it as a prompt to look, not a limit).
 */
export const FIXED_PICK_UP_AREA_M2 = 4;
/** A level that moves more than this leaves a fixed disc or drum out of the liquid or flooded. Common practice, no published source. */
export const FIXED_HEIGHT_TOLERANCE_M = 0.05;
/** Below this working depth a hanging belt has little to hang in. Common practice, no published source. */
export const SHALLOW_DEPTH_M = 0.15;
/** A belt skimmer's frame stands above the lip: less room than this may not take it. Common practice, no published source. */
export const BELT_HEADROOM_M = 0.3;
/** Polymer media soften above about this temperature; ask the maker. Common practice, no published source. */
export const POLYMER_MEDIA_MAX_C = 60;

const m = (metres: number, us: boolean) => (us ? `${(metres / FOOT_METRES).toFixed(1)} ft` : `${metres.toFixed(2)} m`);
const area = (m2: number, us: boolean) => (us ? `${(m2 / FOOT_METRES ** 2).toFixed(0)} ft²` : `${m2.toFixed(1)} m²`);

/** How the kind of skimmer relates to the tank's surface and depth: the area to be skimmed matters, not only the volume of oil. */
export function skimmerReach(kind: EquipmentKind, si: SheetInSi, us: boolean): FitNote {
  if (isGravity(kind)) {
    return {
      topic: 'reach',
      weight: 'advice',
      text: `A gravity device: the whole ${area(si.surfaceM2, us)} surface is where the oil gathers, if the water stays long enough for it to rise (run the tank check).`,
    };
  }
  if (fixedPickUp(kind) && si.surfaceM2 > FIXED_PICK_UP_AREA_M2) {
    return {
      topic: 'reach',
      weight: 'concern',
      text: `${area(si.surfaceM2, us)} of surface for a pick-up that stays in one place: oil far from it drifts in slowly or not at all. Bring the oil to it (a baffle, a gentle surface current, placing it where the oil gathers) or use a tube or mop that floats out across the surface.`,
    };
  }
  if (travelling(kind)) {
    return {
      topic: 'reach',
      weight: 'advice',
      text: `The medium floats out across the ${area(si.surfaceM2, us)} surface and gathers oil along its path: lay its loop through where the oil collects.`,
    };
  }
  return {
    topic: 'reach',
    weight: 'advice',
    text: `${area(si.surfaceM2, us)} of surface is small enough for a pick-up in one place to draw from, once it sits where the oil gathers.`,
  };
}

/** Fit notes by kind and condition, each a short reason (common practice, no published source). */
export function fitNotes(kind: EquipmentKind, sheet: ApplicationSheetContent, si: SheetInSi, mediumMaterial: string | null): FitNote[] {
  const us = sheet.unitSystem === 'us';
  const notes: FitNote[] = [skimmerReach(kind, si, us)];
  const gravity = isGravity(kind);

  if (!gravity && si.levelVariationM > FIXED_HEIGHT_TOLERANCE_M) {
    if (kind === 'disc-skimmer' || kind === 'drum-skimmer') {
      notes.push({
        topic: 'level',
        weight: 'concern',
        text: `The level moves ±${m(si.levelVariationM, us)}: a ${kind === 'disc-skimmer' ? 'disc' : 'drum'} at a fixed height loses its pick-up when the level falls and floods when it rises. Mount it on floats, or choose a belt, tube or mop that reaches through the range.`,
      });
    } else if (kind === 'belt-skimmer') {
      notes.push({
        topic: 'level',
        weight: 'advice',
        text: `The level moves ±${m(si.levelVariationM, us)}: choose a belt long enough to stay immersed at the lowest level (${m(si.workingDepthM - si.levelVariationM, us)} of liquid).`,
      });
    }
  }
  if (!gravity && si.workingDepthM < SHALLOW_DEPTH_M) {
    notes.push({
      topic: 'depth',
      weight: kind === 'belt-skimmer' ? 'concern' : 'advice',
      text:
        kind === 'belt-skimmer'
          ? `Only ${m(si.workingDepthM, us)} of liquid: a hanging belt has little to hang in and picks up sludge from the bottom. A disc, drum or tube suits a shallow tank better.`
          : `A shallow tank (${m(si.workingDepthM, us)} of liquid): check that the medium's immersion depth fits without touching the bottom.`,
    });
  }
  if (kind === 'belt-skimmer') {
    if (si.headroomM === null) {
      notes.push({
        topic: 'headroom',
        weight: 'advice',
        text: 'Measure the clear height above the lip: a belt skimmer stands above the tank.',
      });
    } else if (si.headroomM < BELT_HEADROOM_M) {
      notes.push({
        topic: 'headroom',
        weight: 'concern',
        text: `Only ${m(si.headroomM, us)} above the lip: a belt skimmer's frame and drive stand above the tank and may not fit. A disc, drum or tube sits lower.`,
      });
    }
  }
  const hot = sheet.heated || si.temperatureMaxC > POLYMER_MEDIA_MAX_C;
  const extremePh = (sheet.phMin !== null && sheet.phMin < 5) || (sheet.phMax !== null && sheet.phMax > 10);
  if (!gravity && (hot || sheet.chemicals || extremePh)) {
    const reasons = [
      hot
        ? `water up to ${us ? `${sheet.waterTemperatureMax} °F` : `${sheet.waterTemperatureMax} °C`}${sheet.heated ? ' (heated)' : ''}`
        : null,
      sheet.chemicals ? `chemicals present (${sheet.chemicals})` : null,
      extremePh ? `pH ${sheet.phMin ?? '?'}–${sheet.phMax ?? '?'}` : null,
    ].filter(Boolean);
    notes.push({
      topic: 'materials',
      weight: 'concern',
      text: `Media and wiper materials: ${reasons.join(', ')}. Polymer media soften, swell or crack with heat and some solvents; ask the maker for media rated for these conditions${mediumMaterial ? ` (installed: ${mediumMaterial})` : ''}. Stainless steel stands heat and most solvents.`,
    });
  }
  if (sheet.oilState !== 'free') {
    notes.push({
      topic: 'emulsion',
      weight: 'concern',
      text: gravity
        ? `${sheet.oilState === 'emulsified' ? 'The oil is emulsified' : 'Part of the oil is emulsified'}: it does not rise as a layer, and a gravity separator will not take it out. Break the emulsion upstream (chemical splitting, membrane treatment) or treat it apart.`
        : `${sheet.oilState === 'emulsified' ? 'The oil is emulsified' : 'Part of the oil is emulsified'}: a skimmer takes free oil only, and smooth media (steel belts, discs, drums) pick up little of an emulsion. Break it upstream before counting on a skimmer.`,
    });
  }
  if (!gravity && sheet.oilKind === 'cutting-oil' && /steel|metal/i.test(mediumMaterial ?? '')) {
    notes.push({
      topic: 'coolant',
      weight: 'advice',
      text: `Water-miscible coolant with a metal medium (${mediumMaterial}): plain steel rusts when the coolant runs weak, and a medium that wets with the coolant carries coolant out with the tramp oil. Ask the maker which medium suits this coolant; stainless steel or an oleophilic polymer is the usual answer.`,
    });
  }
  if (sheet.turbulence !== 'calm') {
    notes.push({
      topic: 'turbulence',
      weight: sheet.turbulence === 'agitated' ? 'concern' : 'advice',
      text:
        sheet.turbulence === 'agitated'
          ? 'The surface is agitated: the oil is mixed back into the water and little reaches the pick-up. Skim in a calm corner, behind a baffle, or while the agitation is off.'
          : 'Some surface movement: place the pick-up where the surface is calmest.',
    });
  }
  if (!gravity && sheet.solids === 'heavy') {
    notes.push({
      topic: 'solids',
      weight: kind === 'disc-skimmer' || kind === 'drum-skimmer' ? 'concern' : 'advice',
      text: 'Heavy solids and chips wear wipers and pack troughs: screen the inflow, and check the wipers more often. Tight disc and drum wipers suffer most.',
    });
  }
  notes.push({
    topic: 'placement',
    weight: 'advice',
    text: `Place the pick-up away from where the inflow enters${sheet.inflowAt ? ` (${sheet.inflowAt})` : ''} and where the oil gathers${sheet.oilGathersAt ? ` (${sheet.oilGathersAt})` : ''}; keep the medium immersed as the maker says.`,
  });
  if (!gravity && sheet.supplyPhase === 'none') {
    notes.push({
      topic: 'power',
      weight: 'concern',
      text: 'No electrical supply at the tank: run one, or choose an air-driven unit where the site has compressed air.',
    });
  }
  return notes;
}

/**
 * The removal the sheet's estimated oil load asks for, per hour the skimmer runs, and the rating
 * the 2× rule recommends for it (the oil log's rate flag uses the same rule).
 */
export function sheetSizing(si: SheetInSi): { neededLph: number; recommendedLph: number } | null {
  if (si.oilLoadLitresPerDay === null) return null;
  const neededLph = si.oilLoadLitresPerDay / si.runHoursPerDay;
  return { neededLph, recommendedLph: recommendedRating(neededLph) };
}
