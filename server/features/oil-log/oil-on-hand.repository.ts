import type { DataSource, EntityManager } from 'typeorm';
import type { OilBalanceInput } from '../../domain/oil-collection.js';
import { Site } from '../../kernel/sites/site.entity.js';

export interface OilBalanceRecord extends OilBalanceInput {
  openingOn: string | null;
}

/**
 * What a site's oil on hand is worked out from: the opening balance, and the oil collected and
 * shipped after its date, up to `asOf` (a day, inclusive) or up to now. Null when `asOf` is
 * before the opening balance, where the balance is not known.
 */
export async function oilBalanceInput(
  db: DataSource | EntityManager,
  siteId: string,
  asOf: string | null = null,
): Promise<OilBalanceRecord | null> {
  const [row] = await db.query(
    `SELECT s.oil_opening_balance_litres AS opening, s.oil_opening_balance_on::text AS opening_on, s.oil_storage_capacity_gallons AS capacity,
            (SELECT coalesce(sum(volume_litres), 0) FROM oil_log_entry o WHERE o.site_id = s.id
               AND (s.oil_opening_balance_on IS NULL OR o.collected_on > s.oil_opening_balance_on) AND ($2::date IS NULL OR o.collected_on <= $2)) AS collected,
            (SELECT coalesce(sum(quantity_litres), 0) FROM shipment h WHERE h.site_id = s.id
               AND (s.oil_opening_balance_on IS NULL OR h.shipped_on > s.oil_opening_balance_on) AND ($2::date IS NULL OR h.shipped_on <= $2)) AS shipped
       FROM site s WHERE s.id = $1`,
    [siteId, asOf],
  );
  if (!row || (asOf !== null && row.opening_on !== null && asOf < row.opening_on)) return null;
  return {
    openingLitres: Number(row.opening),
    openingOn: row.opening_on,
    collectedLitres: Number(row.collected),
    shippedLitres: Number(row.shipped),
    capacityGallons: row.capacity === null ? null : Number(row.capacity),
  };
}

export interface OpeningBalance {
  litres: number;
  on: string | null;
}

export async function findOpeningBalance(manager: EntityManager, siteId: string): Promise<OpeningBalance> {
  const site = await manager.findOneByOrFail(Site, { id: siteId });
  return { litres: site.oilOpeningBalanceLitres, on: site.oilOpeningBalanceOn };
}

export async function saveOpeningBalance(manager: EntityManager, siteId: string, balance: { litres: number; on: string }): Promise<void> {
  await manager.update(Site, { id: siteId }, { oilOpeningBalanceLitres: balance.litres, oilOpeningBalanceOn: balance.on });
}
