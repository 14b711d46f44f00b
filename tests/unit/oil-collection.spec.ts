import { unit } from 'mathjs';
import { describe, expect, it } from 'vitest';
import {
  collectionFlags,
  likelyUndersized,
  oilOnHand,
  physicallyPossible,
  ratingLitresPerHour,
} from '../../server/domain/oil-collection.js';
import { convert } from '../../server/domain/units.js';

describe('gallons and litres', () => {
  it('uses the exact US gallon of NIST Handbook 44 (231 in³ = 3.785411784 L)', () => {
    expect(convert(1, 'gal', 'L')).toBe(3.785411784);
    // 231 cubic inches × (2.54 cm)³ = 3785.411784 cm³, by definition.
    expect((231 * 2.54 ** 3) / 1000).toBeCloseTo(3.785411784, 12);
  });
  it.each([1, 55, 275, 1320])('agrees with mathjs (a general-purpose units library) for %s gal', (gallons) => {
    expect(convert(gallons, 'gal', 'L')).toBeCloseTo(unit(gallons, 'gal').toNumber('L'), 9);
    expect(convert(gallons * 3.785411784, 'L', 'gal')).toBeCloseTo(gallons, 9);
  });
  it('converts a rating in gal/h to L/h', () => {
    expect(ratingLitresPerHour(2, 'gal/h')).toBeCloseTo(unit(2, 'gal').toNumber('L'), 9);
  });
});

describe('skimmer sizing (common practice, no published source: rate a skimmer at least twice the removal it must do)', () => {
  it('flags equipment running above half its rating', () => {
    expect(likelyUndersized(5, 10)).toBe(false);
    expect(likelyUndersized(5.01, 10)).toBe(true);
  });
  it('refuses a day above rating × 24 h as not physical', () => {
    expect(physicallyPossible(240, 10)).toBe(true);
    expect(physicallyPossible(240.1, 10)).toBe(false);
  });
  it('flags a collection faster than the rating over the hours run', () => {
    expect(collectionFlags(40, 4, 10)).toEqual([]);
    expect(collectionFlags(41, 4, 10).map((f) => f.code)).toEqual(['above-rating']);
  });
});

describe('oil on hand', () => {
  const gal = 3.785411784;
  it('is the opening balance plus collected minus shipped', () => {
    expect(oilOnHand({ openingLitres: 100, collectedLitres: 50, shippedLitres: 30, capacityGallons: null }).litres).toBe(120);
  });
  it('goes negative when an entry is missing, and says so', () => {
    const balance = oilOnHand({ openingLitres: 0, collectedLitres: 100, shippedLitres: 150, capacityGallons: 500 });
    expect(balance.litres).toBe(-50);
    expect(balance.flags.map((f) => f.code)).toEqual(['negative-balance']);
  });
  it('warns above the storage capacity', () => {
    expect(
      oilOnHand({ openingLitres: 0, collectedLitres: 501 * gal, shippedLitres: 0, capacityGallons: 500 }).flags.map((f) => f.code),
    ).toEqual(['above-capacity']);
  });
  it('cautions above 1,320 US gal of aggregate storage (40 CFR 112.1(d)(2)(ii)), not at it', () => {
    expect(oilOnHand({ openingLitres: 0, collectedLitres: 0, shippedLitres: 0, capacityGallons: 1320 }).flags).toEqual([]);
    expect(oilOnHand({ openingLitres: 0, collectedLitres: 0, shippedLitres: 0, capacityGallons: 1321 }).flags.map((f) => f.code)).toEqual([
      'spcc-threshold',
    ]);
  });
});
