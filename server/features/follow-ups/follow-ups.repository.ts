import type { DataSource, EntityManager } from 'typeorm';
import type { FollowUpQuery, FollowUpStatus, FollowUpView } from '../../contracts/follow-ups.js';
import type { Page } from '../../contracts/paging.js';
import { queryPage } from '../../db/page.js';

type Db = DataSource | EntityManager;

interface FollowUpRow {
  id: string;
  site_id: string;
  kind: string;
  source_entity: string;
  source_id: string;
  title: string;
  due_at: Date;
  status: FollowUpStatus;
  closed_at: Date | null;
  closing_note: string | null;
  closing_file_id: string | null;
}

const view = (row: FollowUpRow): FollowUpView => ({
  id: row.id,
  siteId: row.site_id,
  kind: row.kind,
  sourceEntity: row.source_entity,
  sourceId: row.source_id,
  title: row.title,
  dueAt: row.due_at.toISOString(),
  status: row.status,
  closedAt: row.closed_at?.toISOString() ?? null,
  closingNote: row.closing_note,
  hasClosingFile: row.closing_file_id !== null,
});

export function pageFollowUps(db: Db, siteIds: string[], query: FollowUpQuery): Promise<Page<FollowUpView>> {
  return queryPage(
    db,
    {
      select: 'SELECT * FROM follow_up',
      countFrom: 'FROM follow_up',
      where: `site_id = ANY($1::uuid[]) AND ($2::text IS NULL OR status = $2)`,
      order: `(status = 'open') DESC, due_at ${query.sortDesc ? 'DESC' : 'ASC'}`,
      params: [siteIds, query.status ?? null],
    },
    query,
    view,
  );
}

/** The follow-up, locked for the rest of the transaction. */
export async function lockFollowUp(manager: EntityManager, id: string): Promise<(FollowUpView & { closingFileId: string | null }) | null> {
  const [row]: FollowUpRow[] = await manager.query('SELECT * FROM follow_up WHERE id = $1 FOR UPDATE', [id]);
  return row ? { ...view(row), closingFileId: row.closing_file_id } : null;
}

export async function findFollowUpFile(db: Db, id: string): Promise<{ siteId: string; closingFileId: string | null } | null> {
  const [row]: Array<{ site_id: string; closing_file_id: string | null }> = await db.query(
    'SELECT site_id, closing_file_id FROM follow_up WHERE id = $1',
    [id],
  );
  return row ? { siteId: row.site_id, closingFileId: row.closing_file_id } : null;
}

/** Done, or done late when the deadline has passed. */
export async function closeFollowUp(
  manager: EntityManager,
  id: string,
  closing: { note: string; ownerId: string; fileId: string | null },
): Promise<FollowUpView> {
  // An UPDATE … RETURNING answers [rows, count] through TypeORM.
  const [[row]]: [FollowUpRow[], number] = await manager.query(
    `UPDATE follow_up SET status = CASE WHEN now() > due_at THEN 'done-late' ELSE 'done' END, closed_at = now(), closing_note = $2, owner_id = $3,
     closing_file_id = $4 WHERE id = $1 RETURNING *`,
    [id, closing.note, closing.ownerId, closing.fileId],
  );
  return view(row!);
}
