import type { DataSource } from 'typeorm';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteAllowed } from '../../auth/site-access.js';
import type { SkimmerFitView } from '../../contracts/tools.js';
import { sheetInSi } from '../../domain/application-sheet.js';
import { likelyUndersized, ratingLitresPerHour, recommendedRating, SIZING_FACTOR } from '../../domain/oil-collection.js';
import { fitNotes, sheetSizing, type EquipmentKind } from '../../domain/skimmer-fit.js';
import { siteToday } from '../../kernel/site-today.js';
import { currentSheets } from './application-sheets.repository.js';
import { equipmentCollection } from './skimmer-fit.repository.js';

export const SKIMMER_FIT_CAUTION =
  'Common practice, no published source: rate a skimmer at least twice the removal it must do, because ratings assume ideal oil and conditions; the fit notes are rules of thumb of the trade. ' +
  'Estimates from the oil log and the application sheet, not an engineering design: confirm with the equipment maker and a qualified engineer; local codes and the control authority govern.';

/**
 * Each piece of equipment against the removal it must do — the oil log's peak day and the
 * application sheet's estimated load, whichever is larger — by the 2× rule the oil log's rate
 * flag uses too, with fit notes read from its sheet.
 */
export async function skimmerFit(db: DataSource, user: CurrentUser, siteId: string): Promise<SkimmerFitView> {
  assertSiteAllowed(user, siteId);
  const collection = await equipmentCollection(db, siteId, await siteToday(db, siteId));
  const sheets = await currentSheets(
    db,
    collection.map((item) => item.id),
  );
  const items = collection.map((item) => {
    const ratedLph = ratingLitresPerHour(item.ratedCapacity, item.ratedUnit);
    const sheet = sheets.get(item.id);
    const si = sheet ? sheetInSi(sheet.content) : null;
    const fromSheet = si ? sheetSizing(si) : null;
    const sheetNeededLph = fromSheet?.neededLph ?? null;
    const sizedFrom =
      sheetNeededLph !== null && (item.peakLph === null || sheetNeededLph > item.peakLph)
        ? ('sheet' as const)
        : item.peakLph !== null
          ? ('oil-log' as const)
          : null;
    const neededLph = sizedFrom === 'sheet' ? sheetNeededLph : item.peakLph;
    return {
      equipmentId: item.id,
      name: item.name,
      kind: item.kind,
      daysLogged: item.days,
      typicalLph: item.typicalLph,
      peakLph: item.peakLph,
      ratedLph,
      sheetNeededLph,
      sizedFrom,
      recommendedLph: neededLph === null ? null : recommendedRating(neededLph),
      verdict:
        neededLph === null ? ('no-log' as const) : likelyUndersized(neededLph, ratedLph) ? ('undersized' as const) : ('fits' as const),
      sheetVersion: sheet?.version ?? null,
      notes: sheet && si ? fitNotes(item.kind as EquipmentKind, sheet.content, si, item.mediumMaterial) : [],
    };
  });
  return { sizingFactor: SIZING_FACTOR, items, caution: SKIMMER_FIT_CAUTION };
}
