import type { DataSource } from 'typeorm';
import type { Page } from '../../contracts/paging.js';
import type { TrailEntryView, TrailQuery, TrailVerification } from '../../contracts/trail.js';
import { queryPage } from '../../db/page.js';
import { TrailChainHead } from '../../kernel/trail/trail-chain-head.entity.js';
import { TrailEntry } from '../../kernel/trail/trail-entry.entity.js';

interface TrailRow {
  id: string;
  occurred_at: Date;
  actor_email: string | null;
  action: string;
  entity: string;
  entity_id: string;
  site_id: string | null;
  before: unknown;
  after: unknown;
  actor_name: string | null;
  amendment_id: string | null;
}

// The filters every read of the trail shares (the page and the export).
const trailWhere = `(e.site_id = ANY($1::uuid[]) OR (e.site_id IS NULL AND $2))
        AND ($3::text IS NULL OR e.entity = $3 OR replace(e.entity, '_', '-') = $3) AND ($4::uuid IS NULL OR e.site_id = $4)
        AND ($5::date IS NULL OR e.occurred_at >= $5::date) AND ($6::date IS NULL OR e.occurred_at < $6::date + 1)
        AND ($7::text IS NULL OR e.actor_email ILIKE '%' || $7 || '%' OR u.name ILIKE '%' || $7 || '%')`;
const trailFrom = `FROM trail_entry e LEFT JOIN app_user u ON u.id = e.actor_id`;
const trailParams = (siteIds: string[], withSiteless: boolean, query: TrailQuery) => [
  siteIds,
  withSiteless,
  query.entity ?? null,
  query.siteId ?? null,
  query.from ?? null,
  query.to ?? null,
  query.person ? query.person.replace(/[\\%_]/g, '\\$&') : null,
];
const entryView = (row: TrailRow): TrailEntryView => ({
  id: String(row.id),
  occurredAt: row.occurred_at.toISOString(),
  actorEmail: row.actor_email,
  actorName: row.actor_name,
  action: row.action,
  entity: row.entity,
  entityId: row.entity_id,
  siteId: row.site_id,
  before: row.before,
  after: row.after,
  amendmentId: row.amendment_id,
});

/** Up to `limit` entries for an export, oldest first, with the chain fields. */
export async function trailForExport(dataSource: DataSource, siteIds: string[], withSiteless: boolean, query: TrailQuery, limit: number) {
  const rows: Array<TrailRow & { chain_seq: string; hash: string; time_zone: string | null }> = await dataSource.query(
    `SELECT e.*, u.name AS actor_name, s.time_zone ${trailFrom} LEFT JOIN site s ON s.id = e.site_id WHERE ${trailWhere}
      ORDER BY e.chain_seq LIMIT ${Math.floor(limit)}`,
    trailParams(siteIds, withSiteless, query),
  );
  return rows.map((row) => ({ ...entryView(row), chainSeq: row.chain_seq, hash: row.hash, timeZone: row.time_zone }));
}

/** Entries of the given sites, and of no site when `withSiteless`, newest first unless asked otherwise. */
export function pageTrail(
  dataSource: DataSource,
  siteIds: string[],
  withSiteless: boolean,
  query: TrailQuery,
): Promise<Page<TrailEntryView>> {
  return queryPage(
    dataSource,
    {
      select: `SELECT e.*, u.name AS actor_name ${trailFrom}`,
      countFrom: trailFrom,
      where: trailWhere,
      order: `e.occurred_at ${query.sortDesc === false && query.sortBy === 'occurredAt' ? 'ASC' : 'DESC'}, e.id DESC`,
      params: trailParams(siteIds, withSiteless, query),
    },
    query,
    entryView,
  );
}

/** Recomputes the chain in the database and reads its head; both in one snapshot. */
export async function verifyChain(dataSource: DataSource): Promise<TrailVerification> {
  return dataSource.transaction('REPEATABLE READ', async (manager) => {
    // Raw SQL: the check is a database function over the whole table.
    const breaks: Array<{ chain_seq: string; id: string; reason: string }> = await manager.query('SELECT * FROM trail_chain_break()');
    const head = await manager.findOneByOrFail(TrailChainHead, { onlyRow: true });
    const entries = await manager.count(TrailEntry);
    const first = breaks[0];
    return {
      intact: !first && Number(head.seq) === entries,
      entries,
      head: { seq: Number(head.seq), hash: head.hash },
      firstBreak: first ? { chainSeq: Number(first.chain_seq), id: String(first.id), reason: first.reason } : null,
      checkedAt: new Date().toISOString(),
    };
  });
}
