import { z } from 'zod';
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
});
export type TrailEntryView = z.infer<typeof TrailEntryView>;

export const TrailQuery = sortedPageQuery(['occurredAt']).extend({
  entity: z.string().max(60).optional(),
  siteId: z.uuid().optional(),
});
export type TrailQuery = z.infer<typeof TrailQuery>;
