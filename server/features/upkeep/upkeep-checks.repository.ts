import { In, type DataSource, type EntityManager } from 'typeorm';
import type { UpkeepCheckRequest, UpkeepCheckView } from '../../contracts/oil.js';
import { StoredFile } from '../../kernel/files/stored-file.entity.js';
import { type User } from '../../kernel/people/user.entity.js';
import { Equipment } from '../equipment/equipment.entity.js';
import { UpkeepCheck } from './upkeep-check.entity.js';

type Db = DataSource | EntityManager;

const view = (check: UpkeepCheck, checkedByName: string): UpkeepCheckView => ({
  id: check.id,
  equipmentId: check.equipmentId,
  siteId: check.siteId,
  checkedOn: check.checkedOn,
  items: check.items,
  immersionValue: check.immersionValue,
  immersionUnit: check.immersionUnit,
  failedCount: check.failedCount,
  checkedByName,
});

export type EquipmentRef = Pick<Equipment, 'id' | 'siteId' | 'name'>;

export function findEquipmentRef(db: Db, id: string): Promise<EquipmentRef | null> {
  return db.getRepository(Equipment).findOne({ where: { id }, select: { id: true, siteId: true, name: true } });
}

/** The latest 200 checks of a piece of equipment, each with who made it. */
export async function findUpkeepChecks(db: Db, equipmentId: string): Promise<UpkeepCheckView[]> {
  const checks = await db
    .getRepository(UpkeepCheck)
    .find({ where: { equipmentId }, relations: { checkedByRef: true }, order: { checkedOn: 'DESC', createdAt: 'DESC' }, take: 200 });
  return checks.map((check) => view(check, check.checkedByRef!.name));
}

/** The site of the upkeep check whose items name this photo, if any. */
export async function findPhotoSiteId(db: Db, fileId: string): Promise<string | undefined> {
  // Raw SQL: the photo's id sits inside the checklist's JSON items.
  const [owner]: Array<{ site_id: string }> = await db.query(
    `SELECT c.site_id FROM upkeep_check c, jsonb_array_elements(c.items) item WHERE item->>'photoFileId' = $1 LIMIT 1`,
    [fileId],
  );
  return owner?.site_id;
}

export function countStoredFiles(manager: EntityManager, ids: string[]): Promise<number> {
  return manager.countBy(StoredFile, { id: In(ids) });
}

export async function insertUpkeepCheck(
  manager: EntityManager,
  check: UpkeepCheckRequest & { equipment: EquipmentRef; failedCount: number; checkedBy: Pick<User, 'id' | 'name'> },
): Promise<UpkeepCheckView> {
  const saved = await manager.save(
    UpkeepCheck,
    manager.create(UpkeepCheck, {
      equipmentId: check.equipment.id,
      siteId: check.equipment.siteId,
      checkedOn: check.checkedOn,
      items: check.items,
      immersionValue: check.immersionValue,
      immersionUnit: check.immersionUnit,
      failedCount: check.failedCount,
      checkedBy: check.checkedBy.id,
    }),
  );
  return view(await manager.findOneByOrFail(UpkeepCheck, { id: saved.id }), check.checkedBy.name);
}
