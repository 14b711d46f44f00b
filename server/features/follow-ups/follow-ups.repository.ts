import { In, type DataSource, type EntityManager } from 'typeorm';
import { countdown, type FollowUpQuery, type FollowUpView } from '../../contracts/follow-ups.js';
import type { Page } from '../../contracts/paging.js';
import { queryPage } from '../../db/page.js';
import { FollowUp } from './follow-up.entity.js';

type Db = DataSource | EntityManager;

type FollowUpFields = Pick<
  FollowUp,
  | 'id'
  | 'siteId'
  | 'kind'
  | 'sourceEntity'
  | 'sourceId'
  | 'title'
  | 'dueAt'
  | 'status'
  | 'closedAt'
  | 'closingNote'
  | 'closingFileId'
  | 'awareAt'
  | 'awareSource'
  | 'closedByEntity'
  | 'closedById'
>;

type MailCounts = FollowUpView['mail'];
const noMail: MailCounts = { sent: 0, pending: 0, failed: 0 };

const view = (
  row: FollowUpFields,
  mail: MailCounts = noMail,
  partOf: string | null = null,
  closedByName: string | null = null,
  evidence: { pointCode: string | null; tankChecks: number } = { pointCode: null, tankChecks: 0 },
): FollowUpView => ({
  id: row.id,
  siteId: row.siteId,
  kind: row.kind,
  sourceEntity: row.sourceEntity,
  sourceId: row.sourceId,
  title: row.title,
  dueAt: row.dueAt.toISOString(),
  status: row.status,
  closedAt: row.closedAt?.toISOString() ?? null,
  closingNote: row.closingNote,
  hasClosingFile: row.closingFileId !== null,
  closedBy: row.closedByEntity && row.closedById ? { entity: row.closedByEntity, id: row.closedById } : null,
  awareAt: row.awareAt?.toISOString() ?? null,
  awareSource: row.awareSource,
  mail,
  partOf,
  closedByName,
  ...evidence,
  countdown: countdown(row.dueAt, new Date()),
});

interface FollowUpRow {
  id: string;
  site_id: string;
  kind: string;
  source_entity: string;
  source_id: string;
  title: string;
  due_at: Date;
  status: FollowUp['status'];
  closed_at: Date | null;
  closing_note: string | null;
  closing_file_id: string | null;
  aware_at: Date | null;
  aware_source: string | null;
  closed_by_entity: string | null;
  closed_by_id: string | null;
  group_lead: string;
  owner_name: string | null;
  mail: MailCounts | null;
  point_code: string | null;
  tank_checks: number;
}

/** The follow-ups one violation opens share their source (the exceedance) and their state. */
const violationGroup = `site_id, source_entity, source_id, status`;

// Raw SQL: the page and its count over one filter, read at once (server/db/page.ts).
export function pageFollowUps(db: Db, siteIds: string[], query: FollowUpQuery): Promise<Page<FollowUpView>> {
  return queryPage(
    db,
    {
      select: `SELECT follow_up.*, (SELECT json_build_object('sent', count(*) FILTER (WHERE m.status = 'sent'),
                'pending', count(*) FILTER (WHERE m.status = 'pending'), 'failed', count(*) FILTER (WHERE m.status = 'failed'))
                FROM mail_outbox m WHERE m.follow_up_id = follow_up.id) AS mail,
                (SELECT u.name FROM app_user u WHERE u.id = follow_up.owner_id) AS owner_name,
                follow_up.facts->>'pointCode' AS point_code,
                (SELECT count(*)::int FROM tank_check tc WHERE tc.follow_up_id = follow_up.id) AS tank_checks,
                first_value(id) OVER (PARTITION BY ${violationGroup} ORDER BY due_at, id) AS group_lead FROM follow_up`,
      countFrom: 'FROM follow_up',
      where: `site_id = ANY($1::uuid[]) AND ($2::text IS NULL OR status = $2)`,
      // Open ones by deadline, the soonest first; closed ones by when they closed, the latest first.
      // A violation's follow-ups (its notice, its repeat sampling) stay together, the notice first.
      order: `(status = 'open') DESC, CASE WHEN status = 'open' THEN min(due_at) OVER (PARTITION BY ${violationGroup}) END ${query.sortDesc ? 'DESC' : 'ASC'},
              CASE WHEN status = 'open' THEN source_id END, CASE WHEN status = 'open' THEN due_at END, closed_at DESC NULLS LAST, id`,
      params: [siteIds, query.status ?? null],
    },
    query,
    (row: FollowUpRow) =>
      view(
        {
          id: row.id,
          siteId: row.site_id,
          kind: row.kind,
          sourceEntity: row.source_entity,
          sourceId: row.source_id,
          title: row.title,
          dueAt: row.due_at,
          status: row.status,
          closedAt: row.closed_at,
          closingNote: row.closing_note,
          closingFileId: row.closing_file_id,
          awareAt: row.aware_at,
          awareSource: row.aware_source,
          closedByEntity: row.closed_by_entity,
          closedById: row.closed_by_id,
        },
        row.mail ?? noMail,
        row.source_entity === 'exceedance' && row.group_lead !== row.id ? row.group_lead : null,
        row.owner_name,
        { pointCode: row.point_code, tankChecks: row.tank_checks },
      ),
  );
}

/** The follow-up, locked for the rest of the transaction. */
export async function lockFollowUp(manager: EntityManager, id: string): Promise<FollowUpView | null> {
  const row = await manager.findOne(FollowUp, { where: { id }, lock: { mode: 'pessimistic_write' } });
  return row ? view(row) : null;
}

export function findFollowUpFile(db: Db, id: string): Promise<Pick<FollowUp, 'siteId' | 'closingFileId'> | null> {
  return db.getRepository(FollowUp).findOne({ where: { id }, select: { siteId: true, closingFileId: true } });
}

/** Done, or done late when the deadline has passed (the database's clock decides). */
export async function closeFollowUp(
  manager: EntityManager,
  id: string,
  closing: { note: string; ownerId: string; fileId: string | null },
): Promise<FollowUpView> {
  await manager
    .createQueryBuilder()
    .update(FollowUp)
    .set({
      status: () => `CASE WHEN now() > due_at THEN 'done-late' ELSE 'done' END`,
      closedAt: () => 'now()',
      closingNote: closing.note,
      ownerId: closing.ownerId,
      closingFileId: closing.fileId,
    })
    .where('id = :id', { id })
    .execute();
  return view(await manager.findOneByOrFail(FollowUp, { id }));
}

/** Moves when the site became aware, and the deadline with it by the same amount. */
export async function saveAwareness(manager: EntityManager, id: string, awareAt: Date, source: string): Promise<FollowUpView> {
  await manager
    .createQueryBuilder()
    .update(FollowUp)
    .set({ dueAt: () => 'due_at + (CAST(:awareAt AS timestamptz) - aware_at)', awareAt, awareSource: source.slice(0, 300) })
    .where('id = :id', { id })
    .setParameters({ awareAt })
    .execute();
  return view(await manager.findOneByOrFail(FollowUp, { id }));
}

/** The source ids, among `sourceIds`, of the site's open follow-ups of one kind. */
export async function openFollowUpSources(
  db: Db,
  siteId: string,
  kind: string,
  sourceEntity: string,
  sourceIds: string[],
): Promise<string[]> {
  if (sourceIds.length === 0) return [];
  const rows = await db.getRepository(FollowUp).find({
    select: { sourceId: true },
    where: { siteId, kind, sourceEntity, sourceId: In(sourceIds), status: 'open' },
  });
  return rows.map((row) => row.sourceId);
}
