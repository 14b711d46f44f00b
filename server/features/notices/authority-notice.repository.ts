import type { DataSource, EntityManager } from 'typeorm';
import type { ViolationFacts } from '../../contracts/follow-ups.js';
import type { NoticeDraftRequest } from '../../contracts/notices.js';
import { FollowUp } from '../follow-ups/follow-up.entity.js';
import { AuthorityNotice } from './authority-notice.entity.js';

type Db = DataSource | EntityManager;

export interface NoticeContext {
  followUp: FollowUp & { facts: ViolationFacts };
  company: string;
  site: { name: string; address: string | null; timeZone: string };
  permit: { number: string; authority: string; authorityEmail: string | null };
  /** Site-local "YYYY-MM-DD HH:MM" of the samples behind the figure. */
  sampledAt: string[];
  notice: (AuthorityNotice & { sentByName: string | null }) | null;
}

/** Everything a notice is drafted from, or null when the follow-up is not a violation's. */
export async function loadNoticeContext(db: Db, followUpId: string, lock = false): Promise<NoticeContext | null> {
  const followUp = await db
    .getRepository(FollowUp)
    .findOne({ where: { id: followUpId }, ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}) });
  if (!followUp?.facts) return null;
  const facts = followUp.facts;
  // Raw SQL: one read of the site, its company and the permit, and the samples' local times.
  const [place] = await db.query(
    `SELECT s.name, s.address, s.time_zone, c.name AS company, p.number, p.issuing_authority, p.authority_email
       FROM site s JOIN company c ON c.id = s.company_id JOIN permit p ON p.id = $2 WHERE s.id = $1`,
    [followUp.siteId, facts.permitId],
  );
  const samples: Array<{ at: string }> = await db.query(
    `SELECT DISTINCT to_char(ls.collected_at AT TIME ZONE $2, 'YYYY-MM-DD HH24:MI') AS at
       FROM lab_result r JOIN lab_sample ls ON ls.id = r.sample_id WHERE r.id = ANY($1::uuid[]) ORDER BY 1`,
    [facts.resultIds, place.time_zone],
  );
  const notice = await db.getRepository(AuthorityNotice).findOne({ where: { followUpId }, relations: { sentByRef: true } });
  return {
    followUp: followUp as NoticeContext['followUp'],
    company: place.company,
    site: { name: place.name, address: place.address || null, timeZone: place.time_zone },
    permit: { number: place.number, authority: place.issuing_authority, authorityEmail: place.authority_email },
    sampledAt: samples.map((s) => s.at),
    notice: notice ? Object.assign(notice, { sentByName: notice.sentByRef?.name ?? null }) : null,
  };
}

/** Writes the draft (first save creates it). */
export async function saveNoticeDraft(
  manager: EntityManager,
  context: NoticeContext,
  userId: string,
  draft: NoticeDraftRequest,
): Promise<string> {
  if (context.notice) {
    await manager.update(AuthorityNotice, { id: context.notice.id }, { ...draft, updatedAt: () => 'now()' });
    return context.notice.id;
  }
  const saved = await manager.save(
    AuthorityNotice,
    manager.create(AuthorityNotice, { followUpId: context.followUp.id, siteId: context.followUp.siteId, createdBy: userId, ...draft }),
  );
  return saved.id;
}

export async function markNoticeSent(
  manager: EntityManager,
  id: string,
  sent: { to: string; fileId: string; userId: string },
): Promise<Date> {
  await manager.update(
    AuthorityNotice,
    { id },
    { status: 'sent', toAddress: sent.to, fileId: sent.fileId, sentBy: sent.userId, sentAt: () => 'now()', updatedAt: () => 'now()' },
  );
  return (await manager.findOneByOrFail(AuthorityNotice, { id })).sentAt!;
}

/** The notice follow-up is done (or done late) when its notice went, with the notice as its evidence. */
export async function closeWithNotice(
  manager: EntityManager,
  followUpId: string,
  closing: { note: string; fileId: string; userId: string; noticeId: string },
): Promise<FollowUp> {
  await manager
    .createQueryBuilder()
    .update(FollowUp)
    .set({
      status: () => `CASE WHEN now() > due_at THEN 'done-late' ELSE 'done' END`,
      closedAt: () => 'now()',
      closingNote: closing.note,
      closingFileId: closing.fileId,
      ownerId: closing.userId,
      closedByEntity: 'authority-notice',
      closedById: closing.noticeId,
    })
    .where('id = :id', { id: followUpId })
    .execute();
  return manager.findOneByOrFail(FollowUp, { id: followUpId });
}
