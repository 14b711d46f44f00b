import type { Response } from 'express';
import { DateTime } from 'luxon';
import type { DataSource } from 'typeorm';
import type { UpkeepCheckRequest, UpkeepCheckView } from '../../contracts/oil.js';
import { upkeepChecklists, upkeepItemLabels } from '../../contracts/upkeep-checklists.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteAllowed, assertSiteVisible } from '../../auth/site-access.js';
import { invalid, notFound } from '../../errors/app-error.js';
import { checkUpload, claimStoredFiles, findStoredFileOwner, sendStoredFile, storeFile } from '../../kernel/files/stored-files.js';
import { siteToday } from '../../kernel/site-today.js';
import { closeResolvedFollowUps } from '../follow-ups/close-resolved.js';
import { upkeepDueAnsweredBy } from '../periods/finding-ids.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { openFollowUp } from '../follow-ups/open-follow-up.js';
import { findEquipmentRef, findUpkeepChecks, insertUpkeepCheck } from './upkeep-checks.repository.js';

const photoTypes = ['image/jpeg', 'image/png', 'image/webp', 'image/heic'];

/** A check answers each item of its equipment kind's checklist once, and nothing else. */
function assertWholeChecklist(kind: string, items: UpkeepCheckRequest['items']): void {
  const checklist = upkeepChecklists[kind as keyof typeof upkeepChecklists];
  const answered = new Set(items.map((item) => item.key));
  const unknown = items.find((item) => !checklist.some((known) => known.key === item.key));
  if (unknown) throw invalid({ items: `“${unknown.key}” is not on the checklist of this kind of equipment` });
  const missing = checklist.find((item) => !answered.has(item.key));
  if (missing) throw invalid({ items: `Answer “${missing.label}”: pass, fail or not applicable` });
}

/** Dated checklists per piece of equipment; a failed item opens a follow-up. */
export class UpkeepChecksService {
  constructor(private readonly dataSource: DataSource) {}

  async list(user: CurrentUser, equipmentId: string) {
    const equipment = await findEquipmentRef(this.dataSource, equipmentId);
    assertSiteVisible(user, equipment?.siteId, 'Equipment');
    return {
      items: await findUpkeepChecks(this.dataSource, equipmentId),
      checklist: upkeepChecklists[equipment!.kind as keyof typeof upkeepChecklists],
    };
  }

  /**
   * A photo is uploaded first, for a site, then claimed by the check that names it
   * (photoFileId); one never claimed is dropped after a day.
   */
  async storePhoto(user: CurrentUser, siteId: string, file: Express.Multer.File | undefined) {
    assertSiteAllowed(user, siteId);
    const { mediaType } = await checkUpload(file, photoTypes);
    return this.dataSource.transaction(async (manager) => {
      const stored = await storeFile(manager, file!, mediaType, { userId: user.id, siteId, purpose: 'upkeep-photo' });
      await recordTrail(manager, user, { action: 'upload', entity: 'upkeep-photo', entityId: stored.id, siteId, after: stored });
      return stored;
    });
  }

  /** A claimed photo: whoever sees its site. One still waiting: only who uploaded it. */
  async sendPhoto(user: CurrentUser, fileId: string, res: Response): Promise<void> {
    const file = await findStoredFileOwner(this.dataSource.manager, fileId);
    const visible =
      file?.purpose === 'upkeep-photo' && user.siteIds.includes(file.siteId) && (file.owner !== null || file.uploadedBy === user.id);
    if (!visible) throw notFound('Photo');
    await sendStoredFile(this.dataSource.manager, fileId, res, true);
  }

  async create(user: CurrentUser, request: UpkeepCheckRequest): Promise<UpkeepCheckView> {
    return this.dataSource.transaction(async (manager) => {
      const equipment = await findEquipmentRef(manager, request.equipmentId);
      if (!equipment || !user.siteIds.includes(equipment.siteId)) throw invalid({ equipmentId: 'No such equipment at your sites' });
      if (request.checkedOn > (await siteToday(manager, equipment.siteId))) throw invalid({ checkedOn: 'Cannot be in the future' });
      assertWholeChecklist(equipment.kind, request.items);
      const photoIds = request.items.map((item) => item.photoFileId).filter((id): id is string => id !== null);
      if (photoIds.length !== new Set(photoIds).size) throw invalid({ items: 'Each photo belongs to one item' });
      const failed = request.items.filter((item) => item.outcome === 'fail');
      const after = await insertUpkeepCheck(manager, { ...request, equipment, failedCount: failed.length, checkedBy: user });
      await claimStoredFiles(manager, photoIds, {
        siteId: equipment.siteId,
        purpose: 'upkeep-photo',
        owner: { entity: 'upkeep-check', id: after.id },
        field: 'items',
      });
      if (failed.length > 0) {
        const labels = failed.map((item) => upkeepItemLabels[item.key]!.toLowerCase());
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
      await closeResolvedFollowUps(manager, user, {
        siteId: equipment.siteId,
        kinds: ['upkeep-due'],
        sourceEntity: 'equipment',
        sourceIds: upkeepDueAnsweredBy(equipment.id, request.checkedOn),
        resolvedBy: { entity: 'upkeep-check', id: after.id },
        note: `the upkeep check of ${equipment.name} was done on ${request.checkedOn}`,
      });
      return after;
    });
  }
}
