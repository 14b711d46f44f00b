import type { DataSource, EntityManager } from 'typeorm';
import type { UpkeepCheckRequest, UpkeepCheckView } from '../../contracts/oil.js';
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

export type EquipmentRef = Pick<Equipment, 'id' | 'siteId' | 'name' | 'kind'>;

export function findEquipmentRef(db: Db, id: string): Promise<EquipmentRef | null> {
  return db.getRepository(Equipment).findOne({ where: { id }, select: { id: true, siteId: true, name: true, kind: true } });
}

/** The latest 200 checks of a piece of equipment, each with who made it. */
export async function findUpkeepChecks(db: Db, equipmentId: string): Promise<UpkeepCheckView[]> {
  const checks = await db
    .getRepository(UpkeepCheck)
    .find({ where: { equipmentId }, relations: { checkedByRef: true }, order: { checkedOn: 'DESC', createdAt: 'DESC' }, take: 200 });
  return checks.map((check) => view(check, check.checkedByRef!.name));
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
