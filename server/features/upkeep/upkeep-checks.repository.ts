import type { DataSource, EntityManager } from 'typeorm';
import type { UpkeepCheckRequest, UpkeepCheckView } from '../../contracts/oil.js';

type Db = DataSource | EntityManager;

interface UpkeepCheckRow {
  id: string;
  equipment_id: string;
  site_id: string;
  checked_on: string;
  items: UpkeepCheckView['items'];
  immersion_value: string | null;
  immersion_unit: UpkeepCheckView['immersionUnit'];
  failed_count: number;
  checked_by_name: string;
}

const view = (row: UpkeepCheckRow): UpkeepCheckView => ({
  id: row.id,
  equipmentId: row.equipment_id,
  siteId: row.site_id,
  checkedOn: row.checked_on,
  items: row.items,
  immersionValue: row.immersion_value === null ? null : Number(row.immersion_value),
  immersionUnit: row.immersion_unit,
  failedCount: row.failed_count,
  checkedByName: row.checked_by_name,
});

export interface EquipmentRef {
  id: string;
  siteId: string;
  name: string;
}

export async function findEquipmentRef(db: Db, id: string): Promise<EquipmentRef | null> {
  const [row]: Array<{ id: string; site_id: string; name: string }> = await db.query(
    'SELECT id, site_id, name FROM equipment WHERE id = $1',
    [id],
  );
  return row ? { id: row.id, siteId: row.site_id, name: row.name } : null;
}

export async function findUpkeepChecks(db: Db, equipmentId: string): Promise<UpkeepCheckView[]> {
  const rows: UpkeepCheckRow[] = await db.query(
    `SELECT c.*, u.name AS checked_by_name FROM upkeep_check c JOIN app_user u ON u.id = c.checked_by
      WHERE c.equipment_id = $1 ORDER BY c.checked_on DESC, c.created_at DESC LIMIT 200`,
    [equipmentId],
  );
  return rows.map(view);
}

/** The site of the upkeep check whose items name this photo, if any. */
export async function findPhotoSiteId(db: Db, fileId: string): Promise<string | undefined> {
  const [owner]: Array<{ site_id: string }> = await db.query(
    `SELECT c.site_id FROM upkeep_check c, jsonb_array_elements(c.items) item WHERE item->>'photoFileId' = $1 LIMIT 1`,
    [fileId],
  );
  return owner?.site_id;
}

export async function countStoredFiles(manager: EntityManager, ids: string[]): Promise<number> {
  const [found]: Array<{ n: number }> = await manager.query('SELECT count(*)::int AS n FROM stored_file WHERE id = ANY($1::uuid[])', [ids]);
  return found!.n;
}

export async function insertUpkeepCheck(
  manager: EntityManager,
  check: UpkeepCheckRequest & { equipment: EquipmentRef; failedCount: number; checkedBy: { id: string; name: string } },
): Promise<UpkeepCheckView> {
  const [row]: UpkeepCheckRow[] = await manager.query(
    `INSERT INTO upkeep_check (equipment_id, site_id, checked_on, items, immersion_value, immersion_unit, failed_count, checked_by)
     VALUES ($1, $2, $3, $4, $5, $6, $7, $8) RETURNING *`,
    [
      check.equipment.id,
      check.equipment.siteId,
      check.checkedOn,
      JSON.stringify(check.items),
      check.immersionValue,
      check.immersionUnit,
      check.failedCount,
      check.checkedBy.id,
    ],
  );
  return view({ ...row!, checked_by_name: check.checkedBy.name });
}
