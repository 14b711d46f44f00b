import { unit } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { ApplicationSheetContent } from '../../server/contracts/application-sheet.js';
import { sheetFigures, sheetInSi, tankCheckFromSheet } from '../../server/domain/application-sheet.js';
import { fitNotes, sheetSizing, skimmerReach, FIXED_PICK_UP_AREA_M2 } from '../../server/domain/skimmer-fit.js';

const base = {
  unitSystem: 'metric',
  shape: 'rectangular',
  length: 2,
  width: 1,
  tankDepth: 1.2,
  workingLevel: 1,
  flowMode: 'continuous',
  flowIn: 2,
  waterTemperatureMin: 15,
  waterTemperatureMax: 25,
  oilKind: 'tramp-hydraulic',
  oilSpecificGravity: 0.88,
  oilState: 'free',
  turbulence: 'calm',
  solids: 'none',
  supplyPhase: 'single',
  duty: 'continuous',
} as const;
const sheet = (overrides: Record<string, unknown> = {}) => ApplicationSheetContent.parse({ ...base, ...overrides });
const topics = (notes: Array<{ topic: string }>) => notes.map((note) => note.topic);

describe('the application sheet in SI units (conversions checked against mathjs)', () => {
  it('works out a US tank: 4 ft × 3 ft, 3 ft of liquid, 30 US gal/min, 50 °F', () => {
    const us = sheet({
      unitSystem: 'us',
      length: 4,
      width: 3,
      tankDepth: 4,
      workingLevel: 3,
      flowIn: 30,
      waterTemperatureMin: 50,
      waterTemperatureMax: 75,
      estimatedOilLoad: 24,
    });
    const si = sheetInSi(us);
    expect(si.surfaceM2).toBeCloseTo(unit(12, 'ft^2').toNumber('m^2'), 10);
    expect(si.workingVolumeM3).toBeCloseTo(unit(36, 'ft^3').toNumber('m^3'), 10);
    expect(si.flowInM3h).toBeCloseTo(unit(30 * 60, 'gallon').toNumber('m^3'), 10);
    expect(si.temperatureMinC).toBeCloseTo(unit(50, 'degF').toNumber('degC'), 10);
    expect(si.oilLoadLitresPerDay).toBeCloseTo(unit(24, 'gallon').toNumber('liter'), 10);
    // 36 ft³ = 269.3 US gal (1 US gal = 231 in³, NIST Handbook 44, Appendix C).
    expect(sheetFigures(us)).toMatchObject({ surfaceArea: '12 ft²', workingVolume: '269 US gal' });
  });

  it('works out a round metric tank: π r² of the diameter', () => {
    const round = sheet({ shape: 'round', length: null, width: null, diameter: 2.4, workingLevel: 1.4, tankDepth: 1.8 });
    expect(sheetInSi(round).surfaceM2).toBeCloseTo(Math.PI * 1.2 ** 2, 12);
    expect(sheetFigures(round).workingVolume).toBe('6.33 m³');
  });

  it('checks the tank at its coldest water, the slowest rise (the safe side)', () => {
    expect(tankCheckFromSheet(sheet())).toMatchObject({
      depth: 1,
      flow: 2,
      waterTemperature: 15,
      oilSpecificGravity: 0.88,
      dropletMicrons: 150,
    });
  });
});

describe('bad sheets are refused with the field named', () => {
  const fields = (input: Record<string, unknown>) => {
    const result = ApplicationSheetContent.safeParse({ ...base, ...input });
    return result.success ? [] : result.error.issues.map((issue) => issue.path.join('.'));
  };
  it.each([
    ['a negative length', { length: -1 }, 'length'],
    ['a zero depth', { tankDepth: 0 }, 'tankDepth'],
    ['a working level above the tank', { workingLevel: 1.5 }, 'workingLevel'],
    ['a level that leaves the tank', { levelVariation: 0.5 }, 'levelVariation'],
    ['water below freezing', { waterTemperatureMin: -5 }, 'waterTemperatureMin'],
    ['water above boiling in °F', { unitSystem: 'us', waterTemperatureMin: 60, waterTemperatureMax: 230 }, 'waterTemperatureMax'],
    ['an oil that sinks', { oilSpecificGravity: 1.02 }, 'oilSpecificGravity'],
    ['no flow on a continuous duty', { flowIn: 0 }, 'flowIn'],
    ['a timed duty without hours', { duty: 'timed' }, 'dutyHoursPerDay'],
  ])('%s', (_what, input, field) => {
    expect(fields(input)).toContain(field);
  });
  it('says why an oil of specific gravity 1 or more is refused: it will not float', () => {
    const result = ApplicationSheetContent.safeParse({ ...base, oilSpecificGravity: 1 });
    expect(result.error?.issues[0]?.message).toMatch(/does not float/);
  });
});

// Common practice, no published source: how a kind of skimmer meets the tank and its conditions.
describe('fit notes by kind and condition', () => {
  it('relates a pick-up in one place to the area it must draw from, and a travelling medium to its path', () => {
    const big = sheetInSi(sheet({ length: 4, width: 2 }));
    expect(big.surfaceM2).toBeGreaterThan(FIXED_PICK_UP_AREA_M2);
    expect(skimmerReach('disc-skimmer', big, false).weight).toBe('concern');
    expect(skimmerReach('tube-skimmer', big, false).weight).toBe('advice');
    expect(skimmerReach('disc-skimmer', sheetInSi(sheet()), false).weight).toBe('advice');
  });

  it('warns a disc or drum of a moving level, and tells a belt to reach the lowest level', () => {
    const moving = sheet({ levelVariation: 0.1 });
    const si = sheetInSi(moving);
    expect(fitNotes('disc-skimmer', moving, si, null).find((n) => n.topic === 'level')?.weight).toBe('concern');
    expect(fitNotes('belt-skimmer', moving, si, null).find((n) => n.topic === 'level')?.text).toContain('0.90 m of liquid');
    expect(topics(fitNotes('tube-skimmer', moving, si, null))).not.toContain('level');
  });

  it('notes a shallow tank and little headroom for a belt', () => {
    const shallow = sheet({ workingLevel: 0.1, headroom: 0.2 });
    const notes = fitNotes('belt-skimmer', shallow, sheetInSi(shallow), null);
    expect(topics(notes)).toEqual(expect.arrayContaining(['depth', 'headroom']));
  });

  it('asks about media materials with heat, chemicals or a far pH, and not otherwise', () => {
    const plain = sheet();
    expect(topics(fitNotes('belt-skimmer', plain, sheetInSi(plain), null))).not.toContain('materials');
    for (const hard of [{ heated: true }, { waterTemperatureMax: 70 }, { chemicals: 'Solvent' }, { phMin: 3, phMax: 6 }]) {
      const s = sheet(hard);
      expect(topics(fitNotes('belt-skimmer', s, sheetInSi(s), 'Polymer belt'))).toContain('materials');
    }
  });

  it('says a skimmer takes free oil only when the oil is emulsified, and a gravity separator will not separate it', () => {
    const emulsion = sheet({ oilState: 'emulsified' });
    const si = sheetInSi(emulsion);
    expect(fitNotes('drum-skimmer', emulsion, si, null).find((n) => n.topic === 'emulsion')?.text).toContain('free oil only');
    expect(fitNotes('oil-water-separator', emulsion, si, null).find((n) => n.topic === 'emulsion')?.text).toContain(
      'a gravity separator will not take it out',
    );
  });

  it('notes coolant with a metal medium, agitation, and always the placement away from the inflow', () => {
    const coolant = sheet({ oilKind: 'cutting-oil', turbulence: 'agitated', inflowAt: 'east end' });
    const notes = fitNotes('belt-skimmer', coolant, sheetInSi(coolant), 'Stainless steel belt');
    expect(topics(notes)).toEqual(expect.arrayContaining(['coolant', 'turbulence', 'placement']));
    expect(notes.find((n) => n.topic === 'placement')?.text).toContain('(east end)');
  });
});

describe('sizing from the sheet (the 2× rule, common practice, no published source)', () => {
  it('spreads the estimated daily load over the hours the skimmer runs, then doubles it', () => {
    expect(sheetSizing(sheetInSi(sheet({ estimatedOilLoad: 120 })))).toEqual({ neededLph: 5, recommendedLph: 10 });
    expect(sheetSizing(sheetInSi(sheet({ estimatedOilLoad: 120, duty: 'timed', dutyHoursPerDay: 8 })))).toEqual({
      neededLph: 15,
      recommendedLph: 30,
    });
    expect(sheetSizing(sheetInSi(sheet()))).toBeNull();
  });
});
