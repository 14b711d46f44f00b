import { DateTime } from 'luxon';
import type { DataSource, EntityManager } from 'typeorm';
import type { Target } from '../../kernel/trail/traced-writes.js';
import { DischargePoint } from '../discharge-points/discharge-point.entity.js';
import { Equipment } from './equipment.entity.js';
import type { EquipmentView } from '../../contracts/oil.js';
import { likelyUndersized, ratingLitresPerHour } from '../../domain/oil-collection.js';

type Db = DataSource | EntityManager;
const n = (value: string | null) => (value === null ? null : Number(value));

interface EquipmentRow {
  id: string;
  site_id: string;
  name: string;
  kind: EquipmentView['kind'];
  serves: string;
  rated_capacity: string;
  rated_unit: EquipmentView['ratedUnit'];
  medium_material: string | null;
  upkeep_interval_days: number;
  specific_gravity: string;
  discharge_point_id: string | null;
  active: boolean;
  last_checked_on: string | null;
  average_lph: string | null;
  last_30: string;
}

/** Equipment with what the floor needs to know: upkeep due, running rate against rating. */
export async function findEquipment(db: Db, where: { siteIds: string[]; id?: string }, today: string): Promise<EquipmentView[]> {
  // Raw SQL: each piece of equipment with its last check and running rates, aggregated in one read.
  const rows: EquipmentRow[] = await db.query(
    `SELECT e.*,
            (SELECT max(checked_on) FROM upkeep_check u WHERE u.equipment_id = e.id) AS last_checked_on,
            (SELECT sum(volume_litres) / nullif(sum(hours_run), 0) FROM oil_log_entry o
              WHERE o.equipment_id = e.id AND o.hours_run > 0 AND o.collected_on > $3::date - 90) AS average_lph,
            (SELECT coalesce(sum(volume_litres), 0) FROM oil_log_entry o WHERE o.equipment_id = e.id AND o.collected_on > $3::date - 30) AS last_30
       FROM equipment e
      WHERE e.site_id = ANY($1::uuid[]) AND ($2::uuid IS NULL OR e.id = $2)
      ORDER BY e.active DESC, e.name`,
    [where.siteIds, where.id ?? null, today],
  );
  return rows.map((row) => {
    const rated = ratingLitresPerHour(Number(row.rated_capacity), row.rated_unit);
    const average = n(row.average_lph);
    const nextDue = row.last_checked_on
      ? DateTime.fromISO(row.last_checked_on).plus({ days: row.upkeep_interval_days }).toISODate()!
      : today;
    return {
      id: row.id,
      siteId: row.site_id,
      name: row.name,
      kind: row.kind,
      serves: row.serves,
      ratedCapacity: Number(row.rated_capacity),
      ratedUnit: row.rated_unit,
      mediumMaterial: row.medium_material,
      upkeepIntervalDays: row.upkeep_interval_days,
      specificGravity: Number(row.specific_gravity),
      dischargePointId: row.discharge_point_id,
      active: row.active,
      ratedLitresPerHour: rated,
      lastCheckedOn: row.last_checked_on,
      nextCheckDueOn: nextDue,
      upkeepOverdue: row.active && nextDue < today,
      averageLitresPerHour: average,
      likelyUndersized: average !== null && likelyUndersized(average, rated),
      collectedLitresLast30Days: Number(row.last_30),
    };
  });
}

/** How an equipment row is written and shown by the traced writes. */
export const equipmentTarget = {
  entityClass: Equipment,
  entity: 'equipment',
  view: ({ site: _site, ...row }: Equipment) => row,
  siteIdOf: (row: Equipment) => row.siteId,
  insteadOfDelete: 'Mark it inactive instead: its log entries and checks stay.',
} satisfies Target<Equipment, unknown>;

export async function findEquipmentSiteId(db: Db, id: string): Promise<string | undefined> {
  return (await db.getRepository(Equipment).findOne({ where: { id }, select: { siteId: true } }))?.siteId;
}

/** Whether a discharge point belongs to the site. */
export async function pointIsAtSite(db: Db, pointId: string, siteId: string): Promise<boolean> {
  return db.getRepository(DischargePoint).exists({ where: { id: pointId, siteId } });
}
