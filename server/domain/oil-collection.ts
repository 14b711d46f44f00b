import type { Flag } from '../contracts/flags.js';

/** Litres per hour, from a rating in gal/h or L/h (1 US gal = 3.785411784 L, NIST Handbook 44). */
export function ratingLitresPerHour(rating: number, unit: 'gal/h' | 'L/h'): number {
  return unit === 'gal/h' ? rating * 3.785411784 : rating;
}

/**
 * Common practice, no published source: size a skimmer for at least twice the removal it must
 * do, because ratings assume ideal oil and conditions. Equipment whose average rate while
 * running is above half its rating is likely undersized.
 */
export const SIZING_FACTOR = 2;

export function likelyUndersized(averageLitresPerHour: number, ratedLitresPerHour: number): boolean {
  return ratedLitresPerHour > 0 && averageLitresPerHour > ratedLitresPerHour / SIZING_FACTOR;
}

/** The rating a skimmer should have for a removal rate: the same 2× rule (common practice, no published source). */
export const recommendedRating = (removalLitresPerHour: number) => removalLitresPerHour * SIZING_FACTOR;

/** A day's collection above what the equipment could remove running flat out for 24 hours cannot be real. */
export function physicallyPossible(litres: number, ratedLitresPerHour: number): boolean {
  return litres <= ratedLitresPerHour * 24;
}

export function collectionFlags(litres: number, hoursRun: number | null, ratedLitresPerHour: number): Flag[] {
  if (hoursRun === null || hoursRun <= 0) return [];
  const rate = litres / hoursRun;
  if (rate <= ratedLitresPerHour) return [];
  return [
    {
      code: 'above-rating',
      severity: 'warning',
      message: `Collected faster (${rate.toFixed(1)} L/h) than the equipment's rating (${ratedLitresPerHour.toFixed(1)} L/h): check the volume or the hours run`,
      source: 'equipment rating',
    },
  ];
}

/**
 * 40 CFR 112.1(d)(2)(ii): a facility is exempt from the spill prevention (SPCC) rule only while
 * its aggregate above-ground oil storage capacity is 1,320 US gallons or less, counting
 * containers of 55 gallons or more.
 */
export const SPCC_AGGREGATE_THRESHOLD_GALLONS = 1320;

export interface OilBalanceInput {
  openingLitres: number;
  collectedLitres: number;
  shippedLitres: number;
  capacityGallons: number | null;
}

export function oilOnHand(input: OilBalanceInput): { litres: number; flags: Flag[] } {
  const litres = input.openingLitres + input.collectedLitres - input.shippedLitres;
  const gallons = litres / 3.785411784;
  const flags: Flag[] = [];
  if (litres < 0) {
    flags.push({
      code: 'negative-balance',
      severity: 'error',
      message: 'More oil shipped than opening balance plus collected: an oil log entry is probably missing',
      source: 'oil balance',
    });
  }
  if (input.capacityGallons !== null && gallons > input.capacityGallons) {
    flags.push({
      code: 'above-capacity',
      severity: 'error',
      message: `${Math.round(gallons)} US gal on hand, above the ${input.capacityGallons} US gal storage capacity`,
      source: 'site storage capacity',
    });
  }
  const storage = Math.max(input.capacityGallons ?? 0, gallons);
  if (storage > SPCC_AGGREGATE_THRESHOLD_GALLONS) {
    flags.push({
      code: 'spcc-threshold',
      severity: 'warning',
      message: `Above-ground oil storage above ${SPCC_AGGREGATE_THRESHOLD_GALLONS} US gal in aggregate: a spill prevention (SPCC) plan is required`,
      source: '40 CFR 112.1(d)(2)(ii)',
    });
  }
  return { litres, flags };
}
