import type { DataSource } from 'typeorm';
import { can } from '../../contracts/permissions.js';
import type { TrailQuery } from '../../contracts/trail.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { DateTime } from 'luxon';
import { actionWords, fieldChanges, reasonOf, recordKindWords, recordName } from '../../contracts/trail-words.js';
import { csvLine } from '../../contracts/csv.js';
import type { Download } from '../../http/download.js';
import { pageTrail, trailForExport, verifyChain } from './trail.repository.js';

/** An export stops at this many entries; narrow the dates for more. */
export const TRAIL_EXPORT_ROWS = 50_000;
const localDateTime = (iso: string, zone: string) => DateTime.fromISO(iso, { zone }).toFormat('yyyy-MM-dd HH:mm:ss');

/** Reading the trail (writing it is the kernel's recordTrail, inside each change's transaction). */
export class TrailService {
  constructor(private readonly dataSource: DataSource) {}

  /** Entries of a site: whoever may see the site. Entries of no site (people, sign-ins): by permission. */
  list(user: CurrentUser, query: TrailQuery) {
    return pageTrail(this.dataSource, user.siteIds, can(user.role, 'trail.read-siteless'), query);
  }

  /** The filtered trail as CSV, oldest first: when (site time), who, what in words, the record, field changes, reason, chain. */
  async exportCsv(user: CurrentUser, query: TrailQuery): Promise<Download> {
    const entries = await trailForExport(this.dataSource, user.siteIds, can(user.role, 'trail.read-siteless'), query, TRAIL_EXPORT_ROWS);
    const header = ['when (site time)', 'who', 'action', 'record kind', 'record', 'changes', 'reason', 'amendment', 'chain seq', 'hash'];
    const lines = entries.map((e) =>
      csvLine([
        e.timeZone ? localDateTime(e.occurredAt, e.timeZone) : `${e.occurredAt} (UTC)`,
        e.actorName ? `${e.actorName} <${e.actorEmail}>` : e.actorEmail,
        actionWords(e.action),
        recordKindWords(e.entity),
        recordName(e.before, e.after, e.entityId),
        fieldChanges(e.before, e.after)
          .map((c) => `${c.field}: ${c.before ?? '—'} → ${c.after ?? '—'}`)
          .join('; '),
        reasonOf(e.after),
        e.amendmentId,
        e.chainSeq,
        e.hash,
      ]),
    );
    return {
      bytes: Buffer.from(`\ufeff${[csvLine(header), ...lines].join('\r\n')}\r\n`, 'utf8'),
      mediaType: 'text/csv; charset=utf-8',
      fileName: `decant-trail${query.from ? `-from-${query.from}` : ''}${query.to ? `-to-${query.to}` : ''}.csv`,
    };
  }

  /** Whether every entry still holds its hash and follows the one before (tampering shows here). */
  verify() {
    return verifyChain(this.dataSource);
  }
}
