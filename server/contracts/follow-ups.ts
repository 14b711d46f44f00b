import { z } from 'zod';
import { localDateTime } from './fields.js';
import { uuid } from './fields.js';
import { PageQuery } from './paging.js';

export const followUpStatuses = ['open', 'done', 'done-late'] as const;
export type FollowUpStatus = (typeof followUpStatuses)[number];

export const FollowUpQuery = PageQuery.extend({
  siteId: uuid.optional(),
  status: z.enum(followUpStatuses).optional(),
});
export type FollowUpQuery = z.output<typeof FollowUpQuery>;

/** Closed with a note (and, as multipart, optionally a file: the notice sent, a lab report). */
export const CloseFollowUpRequest = z.object({ note: z.string().trim().min(3, 'Say how it was closed').max(2000) });
export type CloseFollowUpRequest = z.output<typeof CloseFollowUpRequest>;

/** A coordinator's correction of when the site became aware: the deadline moves with it. */
export const CorrectAwarenessRequest = z.object({
  awareAt: localDateTime,
  reason: z.string().trim().min(3, 'Say why the time is corrected').max(500),
});
export type CorrectAwarenessRequest = z.output<typeof CorrectAwarenessRequest>;

/** What a violation was, as compiled: kept on its follow-ups to draft the notice to the authority. */
export interface ViolationFacts {
  permitId: string;
  permitNumber: string;
  pointCode: string;
  parameter: string;
  statistic: string;
  /** A day (YYYY-MM-DD) or a month (YYYY-MM) for an average. */
  date: string;
  shownValue: string;
  limit: number;
  unit: string;
  resultIds: string[];
}

/** Anything with a deadline, opened by the server's rules. */
export interface FollowUpView {
  id: string;
  siteId: string;
  kind: string;
  sourceEntity: string;
  sourceId: string;
  title: string;
  dueAt: string;
  status: FollowUpStatus;
  closedAt: string | null;
  closingNote: string | null;
  hasClosingFile: boolean;
  /** The record that resolved it, when Decant closed it by itself. */
  closedBy: { entity: string; id: string } | null;
  /** For a violation's notice: when the site became aware (the clock's start) and from what. */
  awareAt: string | null;
  awareSource: string | null;
  /** Who closed it, or whose change closed it by itself. */
  closedByName: string | null;
  /** For a violation's later follow-up (its repeat sampling): the follow-up it is grouped under. */
  partOf: string | null;
  /** Its mails: sent, still being tried, and given up (not delivered). */
  mail: { sent: number; pending: number; failed: number };
  /** For a violation: the discharge point of the result, where equipment can be looked at for a cause. */
  pointCode: string | null;
  /** Tank checks kept as its evidence. */
  tankChecks: number;
  /** Time left to its deadline, in words, as of the answer. */
  countdown: Countdown;
}

export interface Countdown {
  /** "in 5 hours", "in 3 days", "21 days overdue": the same words on every screen. */
  text: string;
  overdue: boolean;
  /** Due within 48 hours, or overdue. */
  soon: boolean;
}

/**
 * The time left to a deadline, in words: hours below 48, days above. Computed by the server when
 * it answers, so every screen shows the same words for the same deadline.
 */
export function countdown(dueAt: Date, now: Date): Countdown {
  const hours = (dueAt.getTime() - now.getTime()) / 3_600_000;
  const abs = Math.abs(hours);
  const span = abs >= 48 ? `${Math.round(abs / 24)} days` : `${Math.round(abs)} ${Math.round(abs) === 1 ? 'hour' : 'hours'}`;
  return hours < 0 ? { text: `${span} overdue`, overdue: true, soon: true } : { text: `in ${span}`, overdue: false, soon: hours < 48 };
}
