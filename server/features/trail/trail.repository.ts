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
      select: 'SELECT * FROM trail_entry',
      countFrom: 'FROM trail_entry',
      where: `(site_id = ANY($1::uuid[]) OR (site_id IS NULL AND $2))
        AND ($3::text IS NULL OR entity = $3) AND ($4::uuid IS NULL OR site_id = $4)`,
      order: `occurred_at ${query.sortDesc === false && query.sortBy === 'occurredAt' ? 'ASC' : 'DESC'}, id DESC`,
      params: [siteIds, withSiteless, query.entity ?? null, query.siteId ?? null],
    },
    query,
    (row: TrailRow): TrailEntryView => ({
      id: String(row.id),
      occurredAt: row.occurred_at.toISOString(),
      actorEmail: row.actor_email,
      action: row.action,
      entity: row.entity,
      entityId: row.entity_id,
      siteId: row.site_id,
      before: row.before,
      after: row.after,
    }),
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
