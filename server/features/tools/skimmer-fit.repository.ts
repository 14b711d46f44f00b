import type { DataSource } from 'typeorm';

export interface EquipmentCollection {
  id: string;
  name: string;
  kind: string;
  ratedCapacity: number;
  ratedUnit: 'gal/h' | 'L/h';
  mediumMaterial: string | null;
  days: number;
  /** The median and the highest day's collection per hour run, L/h; null without hours run. */
  typicalLph: number | null;
  peakLph: number | null;
}

/**
 * Each piece of equipment of a site with its oil log over the last 90 days, per hour run (a day
 * without hours run counts 24 h: a skimmer left running).
 */
export async function equipmentCollection(db: DataSource, siteId: string, today: string): Promise<EquipmentCollection[]> {
  // Raw SQL: a median and a maximum per equipment in one pass over the log.
  const rows = await db.query(
    `SELECT e.id, e.name, e.kind, e.rated_capacity::float8 AS rated_capacity, e.rated_unit, e.medium_material,
            count(l.id)::int AS days,
            percentile_cont(0.5) WITHIN GROUP (ORDER BY l.volume_litres / COALESCE(NULLIF(l.hours_run, 0), 24))::float8 AS typical,
            max(l.volume_litres / COALESCE(NULLIF(l.hours_run, 0), 24))::float8 AS peak
       FROM equipment e
       LEFT JOIN oil_log_entry l ON l.equipment_id = e.id AND l.collected_on > $2::date - 90 AND l.collected_on <= $2::date
      WHERE e.site_id = $1 AND e.active
      GROUP BY e.id ORDER BY e.name`,
    [siteId, today],
  );
  return rows.map((row: Record<string, unknown>) => ({
    id: row.id as string,
    name: row.name as string,
    kind: row.kind as string,
    ratedCapacity: row.rated_capacity as number,
    ratedUnit: row.rated_unit as 'gal/h' | 'L/h',
    mediumMaterial: (row.medium_material as string | null) ?? null,
    days: row.days as number,
    typicalLph: (row.typical as number | null) ?? null,
    peakLph: (row.peak as number | null) ?? null,
  }));
}
