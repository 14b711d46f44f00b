import type { Response } from 'express';
import { DateTime } from 'luxon';
import type { DataSource } from 'typeorm';
import { upkeepItems, type UpkeepCheckRequest, type UpkeepCheckView } from '../../contracts/oil.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteVisible } from '../../auth/site-access.js';
import { invalid } from '../../errors/app-error.js';
import { checkUpload, sendStoredFile, storeFile } from '../../kernel/files/stored-files.js';
import { siteToday } from '../../kernel/site-today.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { openFollowUp } from '../follow-ups/open-follow-up.js';
import { countStoredFiles, findEquipmentRef, findPhotoSiteId, findUpkeepChecks, insertUpkeepCheck } from './upkeep-checks.repository.js';

const photoTypes = ['image/jpeg', 'image/png', 'image/webp', 'image/heic'];

/** Dated checklists per piece of equipment; a failed item opens a follow-up. */
export class UpkeepChecksService {
  constructor(private readonly dataSource: DataSource) {}

  async list(user: CurrentUser, equipmentId: string) {
    const equipment = await findEquipmentRef(this.dataSource, equipmentId);
    assertSiteVisible(user, equipment?.siteId, 'Equipment');
    return { items: await findUpkeepChecks(this.dataSource, equipmentId), checklist: upkeepItems };
  }

  /** A photo is uploaded first, then named by the check's item (photoFileId). */
  async storePhoto(user: CurrentUser, file: Express.Multer.File | undefined) {
    const { mediaType } = await checkUpload(file, photoTypes);
    return this.dataSource.transaction((manager) => storeFile(manager, file!, mediaType, user.id));
  }

  async sendPhoto(user: CurrentUser, fileId: string, res: Response): Promise<void> {
    assertSiteVisible(user, await findPhotoSiteId(this.dataSource, fileId), 'Photo');
    await sendStoredFile(this.dataSource.manager, fileId, res, true);
  }

  async create(user: CurrentUser, request: UpkeepCheckRequest): Promise<UpkeepCheckView> {
    return this.dataSource.transaction(async (manager) => {
      const equipment = await findEquipmentRef(manager, request.equipmentId);
      if (!equipment || !user.siteIds.includes(equipment.siteId)) throw invalid({ equipmentId: 'No such equipment at your sites' });
      if (request.checkedOn > (await siteToday(manager, equipment.siteId))) throw invalid({ checkedOn: 'Cannot be in the future' });
      const photoIds = request.items.map((item) => item.photoFileId).filter((id): id is string => id !== null);
      if (photoIds.length > 0 && (await countStoredFiles(manager, photoIds)) !== new Set(photoIds).size) {
        throw invalid({ items: 'A photo was not found; upload it first' });
      }
      const failed = request.items.filter((item) => item.outcome === 'fail');
      const after = await insertUpkeepCheck(manager, { ...request, equipment, failedCount: failed.length, checkedBy: user });
      if (failed.length > 0) {
        const labels = failed.map((item) => upkeepItems.find((known) => known.key === item.key)!.label.toLowerCase());
        await openFollowUp(manager, {
          siteId: equipment.siteId,
          kind: 'upkeep-failed',
          sourceEntity: 'upkeep-check',
          sourceId: after.id,
          title: `Fix ${equipment.name}: ${labels.join('; ')}`,
          dueAt: DateTime.fromISO(request.checkedOn).plus({ days: 7 }).toJSDate(),
        });
      }
      await recordTrail(manager, user, { action: 'create', entity: 'upkeep-check', entityId: after.id, siteId: equipment.siteId, after });
      return after;
    });
  }
}
