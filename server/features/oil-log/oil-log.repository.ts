import type { DataSource, DeepPartial, EntityManager, QueryDeepPartialEntity } from 'typeorm';
import { Equipment } from '../equipment/equipment.entity.js';
import { OilLogEntry } from './oil-log-entry.entity.js';
import type { OilLogEntryView, oilLogSortKeys } from '../../contracts/oil.js';
import type { Page } from '../../contracts/paging.js';
import { queryPage } from '../../db/page.js';

type Db = DataSource | EntityManager;
const n = (value: string | null) => (value === null ? null : Number(value));

interface OilLogEntryRow {
  id: string;
  equipment_id: string;
  equipment_name: string;
  site_id: string;
  collected_on: string;
  volume_litres: string;
  entered_volume: string;
  entered_unit: OilLogEntryView['enteredUnit'];
  hours_run: string | null;
  water_temperature_c: string | null;
  observations: string[];
  note: string;
  flags: OilLogEntryView['flags'];
  entered_by: string;
  entered_by_name: string;
  created_at: Date;
}

// Raw SQL: one joined read serves the entry, the paged list (with its count) and the equipment's name.
const select = `SELECT o.*, e.name AS equipment_name, u.name AS entered_by_name
  FROM oil_log_entry o JOIN equipment e ON e.id = o.equipment_id JOIN app_user u ON u.id = o.entered_by`;

function view(row: OilLogEntryRow): OilLogEntryView {
  return {
    id: row.id,
    equipmentId: row.equipment_id,
    equipmentName: row.equipment_name,
    siteId: row.site_id,
    collectedOn: row.collected_on,
    volumeLitres: Number(row.volume_litres),
    enteredVolume: Number(row.entered_volume),
    enteredUnit: row.entered_unit,
    hoursRun: n(row.hours_run),
    waterTemperatureC: n(row.water_temperature_c),
    observations: row.observations,
    note: row.note,
    flags: row.flags,
    enteredBy: row.entered_by,
    enteredByName: row.entered_by_name,
    createdAt: row.created_at.toISOString(),
  };
}

export async function findOilLogEntry(db: Db, id: string): Promise<OilLogEntryView | null> {
  const [row]: OilLogEntryRow[] = await db.query(`${select} WHERE o.id = $1`, [id]);
  return row ? view(row) : null;
}

const sorts: Record<(typeof oilLogSortKeys)[number], string> = {
  collectedOn: 'o.collected_on',
  volumeLitres: 'o.volume_litres',
  equipmentName: 'e.name',
};

export async function pageOilLog(
  db: Db,
  siteIds: string[],
  query: {
    page: number;
    pageSize: number;
    sortBy?: (typeof oilLogSortKeys)[number];
    sortDesc?: boolean;
    equipmentId?: string;
    from?: string;
    to?: string;
  },
): Promise<Page<OilLogEntryView>> {
  return queryPage(
    db,
    {
      select,
      countFrom: 'FROM oil_log_entry o',
      where: `o.site_id = ANY($1::uuid[]) AND ($2::uuid IS NULL OR o.equipment_id = $2)
      AND ($3::date IS NULL OR o.collected_on >= $3) AND ($4::date IS NULL OR o.collected_on <= $4)`,
      order: `${query.sortBy ? sorts[query.sortBy] : 'o.collected_on'} ${query.sortBy && !query.sortDesc ? 'ASC' : 'DESC'}, o.created_at DESC`,
      params: [siteIds, query.equipmentId ?? null, query.from ?? null, query.to ?? null],
    },
    query,
    view,
  );
}

/** Litres collected per day, ISO week or month (the site's local dates). */
export async function oilTotals(
  db: Db,
  siteId: string,
  by: 'day' | 'week' | 'month',
  filter: { equipmentId?: string; from?: string; to?: string },
) {
  const rows = await db.query(
    `SELECT to_char(date_trunc($2, collected_on::timestamp), 'YYYY-MM-DD') AS period, sum(volume_litres) AS litres, count(*)::int AS entries
       FROM oil_log_entry WHERE site_id = $1 AND ($3::uuid IS NULL OR equipment_id = $3)
        AND ($4::date IS NULL OR collected_on >= $4) AND ($5::date IS NULL OR collected_on <= $5)
      GROUP BY 1 ORDER BY 1`,
    [siteId, by, filter.equipmentId ?? null, filter.from ?? null, filter.to ?? null],
  );
  return rows.map((row: { period: string; litres: string; entries: number }) => ({
    period: row.period,
    litres: Number(row.litres),
    entries: row.entries,
  }));
}

export function findEquipmentRating(db: Db, id: string) {
  return db
    .getRepository(Equipment)
    .findOne({ where: { id }, select: { id: true, siteId: true, ratedCapacity: true, ratedUnit: true, active: true } });
}

export async function insertOilLogEntry(manager: EntityManager, entry: DeepPartial<OilLogEntry>): Promise<string> {
  return (await manager.save(OilLogEntry, manager.create(OilLogEntry, entry))).id;
}

export async function updateOilLogEntry(manager: EntityManager, id: string, changes: QueryDeepPartialEntity<OilLogEntry>): Promise<void> {
  await manager.update(OilLogEntry, { id }, changes);
}
