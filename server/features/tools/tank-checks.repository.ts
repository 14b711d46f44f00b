import type { DataSource, EntityManager } from 'typeorm';
import type { SavedTankCheck } from '../../contracts/tools.js';
import { Equipment } from '../equipment/equipment.entity.js';
import { FollowUp } from '../follow-ups/follow-up.entity.js';
import { TankCheck } from './tank-check.entity.js';

type Db = DataSource | EntityManager;

const view = (check: TankCheck): SavedTankCheck => ({
  id: check.id,
  siteId: check.siteId,
  equipmentId: check.equipmentId,
  equipmentName: check.equipment?.name ?? null,
  followUpId: check.followUpId,
  followUpTitle: check.followUp?.title ?? null,
  input: check.input,
  result: check.result,
  checkedByName: check.checkedByRef?.name ?? '',
  checkedAt: check.createdAt.toISOString(),
});

const relations = { equipment: true, followUp: true, checkedByRef: true } as const;

export async function insertTankCheck(manager: EntityManager, check: Omit<TankCheck, 'id' | 'createdAt'>): Promise<SavedTankCheck> {
  const saved = await manager.getRepository(TankCheck).save(check);
  return view((await manager.getRepository(TankCheck).findOne({ where: { id: saved.id }, relations }))!);
}

export async function findTankCheck(db: Db, id: string): Promise<SavedTankCheck | null> {
  const check = await db.getRepository(TankCheck).findOne({ where: { id }, relations });
  return check ? view(check) : null;
}

/** The latest 100 checks of a piece of equipment or attached to a follow-up. */
export async function listTankChecks(db: Db, where: { equipmentId?: string; followUpId?: string }): Promise<SavedTankCheck[]> {
  const checks = await db.getRepository(TankCheck).find({ where, relations, order: { createdAt: 'DESC' }, take: 100 });
  return checks.map(view);
}

/** Attaches a check to a follow-up, once: the table's trigger refuses any other change. */
export async function attachTankCheck(manager: EntityManager, id: string, followUpId: string): Promise<void> {
  await manager.getRepository(TankCheck).update({ id }, { followUpId });
}

export function findFollowUpRef(db: Db, id: string) {
  return db.getRepository(FollowUp).findOne({ where: { id }, select: { id: true, siteId: true, title: true, kind: true, facts: true } });
}

/** Active equipment at a site: one piece (by id), those at one of its discharge points (by code), or all. */
export function equipmentAt(db: Db, siteId: string, only: { id?: string; pointCode?: string | null } = {}) {
  const pointCode = only.id ? null : only.pointCode;
  return db.getRepository(Equipment).find({
    where: { siteId, active: true, ...(only.id ? { id: only.id } : {}), ...(pointCode ? { dischargePoint: { code: pointCode } } : {}) },
    relations: pointCode ? { dischargePoint: true } : {},
    order: { name: 'ASC' },
  });
}
