import type { DataSource, EntityManager } from 'typeorm';
import type { ApplicationSheetContent, ApplicationSheetVersion } from '../../contracts/application-sheet.js';
import { sheetFigures } from '../../domain/application-sheet.js';
import { Equipment } from '../equipment/equipment.entity.js';
import { ApplicationSheet } from './application-sheet.entity.js';

type Db = DataSource | EntityManager;

const view = (sheet: ApplicationSheet): ApplicationSheetVersion => ({
  id: sheet.id,
  equipmentId: sheet.equipmentId,
  version: sheet.version,
  content: sheet.content,
  computed: sheetFigures(sheet.content),
  reason: sheet.reason,
  savedByName: sheet.savedByRef?.name ?? '',
  savedAt: sheet.savedAt.toISOString(),
});

/** Every version of a piece of equipment's sheet, the latest first. */
export async function sheetVersions(db: Db, equipmentId: string): Promise<ApplicationSheetVersion[]> {
  const rows = await db
    .getRepository(ApplicationSheet)
    .find({ where: { equipmentId }, relations: { savedByRef: true }, order: { version: 'DESC' } });
  return rows.map(view);
}

/** The latest version of each of these pieces of equipment's sheets. */
export async function currentSheets(db: Db, equipmentIds: string[]): Promise<Map<string, ApplicationSheetVersion>> {
  if (equipmentIds.length === 0) return new Map();
  const rows = await db
    .getRepository(ApplicationSheet)
    .createQueryBuilder('s')
    .distinctOn(['s.equipment_id'])
    .leftJoinAndSelect('s.savedByRef', 'u')
    .where('s.equipment_id IN (:...ids)', { ids: equipmentIds })
    .orderBy('s.equipment_id')
    .addOrderBy('s.version', 'DESC')
    .getMany();
  return new Map(rows.map((row) => [row.equipmentId, view(row)]));
}

export async function findSheetVersion(db: Db, id: string): Promise<(ApplicationSheetVersion & { siteId: string }) | null> {
  const row = await db.getRepository(ApplicationSheet).findOne({ where: { id }, relations: { savedByRef: true } });
  return row ? { ...view(row), siteId: row.siteId } : null;
}

/** Appends the next version; the equipment row is locked by the caller so two saves cannot take one number. */
export async function appendSheetVersion(
  manager: EntityManager,
  sheet: { equipmentId: string; siteId: string; content: ApplicationSheetContent; reason: string; savedBy: string },
): Promise<string> {
  const { next } = await manager
    .getRepository(ApplicationSheet)
    .createQueryBuilder('s')
    .select('coalesce(max(s.version), 0) + 1', 'next')
    .where('s.equipment_id = :id', { id: sheet.equipmentId })
    .getRawOne();
  const saved = await manager.getRepository(ApplicationSheet).save({ ...sheet, version: Number(next) });
  return saved.id;
}

/** The equipment a sheet or check belongs to, locked for the rest of the transaction. */
export async function lockEquipment(manager: EntityManager, id: string) {
  return manager.getRepository(Equipment).createQueryBuilder('e').setLock('pessimistic_write').where('e.id = :id', { id }).getOne();
}
