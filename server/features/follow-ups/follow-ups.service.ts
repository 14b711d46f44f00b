import type { Response } from 'express';
import type { DataSource } from 'typeorm';
import { DateTime } from 'luxon';
import type { CloseFollowUpRequest, CorrectAwarenessRequest, FollowUpQuery, FollowUpView } from '../../contracts/follow-ups.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteAllowed, assertSiteVisible } from '../../auth/site-access.js';
import { conflict, invalid, notFound } from '../../errors/app-error.js';
import { checkUpload, sendStoredFile, storeFile } from '../../kernel/files/stored-files.js';
import { siteZone } from '../../kernel/site-today.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { closeFollowUp, findFollowUpFile, lockFollowUp, pageFollowUps, saveAwareness } from './follow-ups.repository.js';

const evidenceTypes = ['application/pdf', 'image/jpeg', 'image/png', 'image/webp'];

/** Follow-ups are opened by the server's rules; people close them, with a note, in the trail. */
export class FollowUpsService {
  constructor(private readonly dataSource: DataSource) {}

  list(user: CurrentUser, query: FollowUpQuery) {
    if (query.siteId) assertSiteAllowed(user, query.siteId);
    return pageFollowUps(this.dataSource, query.siteId ? [query.siteId] : user.siteIds, query);
  }

  async close(user: CurrentUser, id: string, request: CloseFollowUpRequest, file: Express.Multer.File | undefined): Promise<FollowUpView> {
    const checkedFile = file ? await checkUpload(file, evidenceTypes) : null;
    return this.dataSource.transaction(async (manager) => {
      const before = await lockFollowUp(manager, id);
      assertSiteVisible(user, before?.siteId, 'Follow-up');
      if (before!.status !== 'open') throw conflict('This follow-up is already closed');
      const stored = checkedFile
        ? await storeFile(manager, file!, checkedFile.mediaType, {
            userId: user.id,
            siteId: before!.siteId,
            purpose: 'follow-up-evidence',
            owner: { entity: 'follow-up', id },
          })
        : null;
      const after = await closeFollowUp(manager, id, { note: request.note, ownerId: user.id, fileId: stored?.id ?? null });
      await recordTrail(manager, user, { action: 'close', entity: 'follow-up', entityId: id, siteId: after.siteId, before, after });
      return after;
    });
  }

  /**
   * A coordinator corrects when the site became aware of a violation (the certificate came in
   * earlier or later than Decant knew): the clock and the deadline move, the reason is kept.
   */
  async correctAwareness(user: CurrentUser, id: string, request: CorrectAwarenessRequest): Promise<FollowUpView> {
    return this.dataSource.transaction(async (manager) => {
      const before = await lockFollowUp(manager, id);
      assertSiteVisible(user, before?.siteId, 'Follow-up');
      if (before!.status !== 'open') throw conflict('This follow-up is closed: its deadline no longer runs');
      if (!before!.awareAt) throw invalid({ awareAt: 'This follow-up has no awareness time: its deadline does not run from one' });
      const zone = await siteZone(manager, before!.siteId);
      const awareAt = DateTime.fromISO(request.awareAt, { zone }).toJSDate();
      if (awareAt.getTime() > Date.now()) throw invalid({ awareAt: 'Cannot be in the future' });
      const after = await saveAwareness(manager, id, awareAt, `corrected by ${user.name}: ${request.reason}`);
      await recordTrail(manager, user, {
        action: 'update',
        entity: 'follow-up',
        entityId: id,
        siteId: after.siteId,
        before: { awareAt: before!.awareAt, awareSource: before!.awareSource, dueAt: before!.dueAt },
        after: { awareAt: after.awareAt, awareSource: after.awareSource, dueAt: after.dueAt, reason: request.reason },
      });
      return after;
    });
  }

  async sendFile(user: CurrentUser, id: string, res: Response): Promise<void> {
    const followUp = await findFollowUpFile(this.dataSource, id);
    assertSiteVisible(user, followUp?.siteId, 'Follow-up');
    if (!followUp!.closingFileId) throw notFound('File');
    await sendStoredFile(this.dataSource.manager, followUp!.closingFileId, res, true);
  }
}
