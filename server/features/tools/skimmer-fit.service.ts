import type { DataSource } from 'typeorm';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteAllowed } from '../../auth/site-access.js';
import type { SkimmerFitView } from '../../contracts/tools.js';
import { likelyUndersized, ratingLitresPerHour, recommendedRating, SIZING_FACTOR } from '../../domain/oil-collection.js';
import { siteToday } from '../../kernel/site-today.js';
import { equipmentCollection } from './skimmer-fit.repository.js';

export const SKIMMER_FIT_CAUTION =
  'Common practice, no published source: rate a skimmer at least twice the removal it must do, because ratings assume ideal oil and conditions. ' +
  'An estimate from the oil log: confirm with the equipment maker and a qualified engineer; local codes and the control authority govern.';

/** Each piece of equipment against the removal its oil log shows, by the 2× rule the oil log's rate flag uses too. */
export async function skimmerFit(db: DataSource, user: CurrentUser, siteId: string): Promise<SkimmerFitView> {
  assertSiteAllowed(user, siteId);
  const items = (await equipmentCollection(db, siteId, await siteToday(db, siteId))).map((item) => {
    const ratedLph = ratingLitresPerHour(item.ratedCapacity, item.ratedUnit);
    const neededLph = item.peakLph;
    return {
      equipmentId: item.id,
      name: item.name,
      kind: item.kind,
      daysLogged: item.days,
      typicalLph: item.typicalLph,
      peakLph: item.peakLph,
      ratedLph,
      recommendedLph: neededLph === null ? null : recommendedRating(neededLph),
      verdict:
        neededLph === null ? ('no-log' as const) : likelyUndersized(neededLph, ratedLph) ? ('undersized' as const) : ('fits' as const),
    };
  });
  return { sizingFactor: SIZING_FACTOR, items, caution: SKIMMER_FIT_CAUTION };
}
