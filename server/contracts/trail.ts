import { z } from 'zod';
import { isoDate } from './fields.js';
import { sortedPageQuery } from './paging.js';

export const TrailEntryView = z.object({
  id: z.string(),
  occurredAt: z.string(),
  actorEmail: z.string().nullable(),
  action: z.string(),
  entity: z.string(),
  entityId: z.string(),
  siteId: z.string().nullable(),
  before: z.unknown().nullable(),
  after: z.unknown().nullable(),
  actorName: z.string().nullable(),
  amendmentId: z.string().nullable(),
});
export type TrailEntryView = z.infer<typeof TrailEntryView>;

export const TrailQuery = sortedPageQuery(['occurredAt']).extend({
  entity: z.string().max(60).optional(),
  siteId: z.uuid().optional(),
  /** From this day (UTC) on. */
  from: isoDate.optional(),
  /** Through this day (UTC). */
  to: isoDate.optional(),
  /** Part of the person's e-mail address or name. */
  person: z.string().trim().max(120).optional(),
});
export type TrailQuery = z.infer<typeof TrailQuery>;

/** The trail's hash chain, recomputed entry by entry by the database (trail_chain_break()). */
export const TrailVerification = z.object({
  intact: z.boolean(),
  entries: z.number().int(),
  head: z.object({ seq: z.number().int(), hash: z.string() }),
  firstBreak: z.object({ chainSeq: z.number().int(), id: z.string(), reason: z.string() }).nullable(),
  checkedAt: z.string(),
});
export type TrailVerification = z.infer<typeof TrailVerification>;
