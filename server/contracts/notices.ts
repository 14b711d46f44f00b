import { z } from 'zod';
import { isoDate } from './fields.js';

/** The follow-up kinds a notice to the control authority answers. */
export const noticeKinds = ['notify-control-authority', 'report-within-24-hours'] as const;

const text = z.string().trim().max(4000);

export const NoticeDraftRequest = z.object({
  cause: text.default(''),
  correctiveAction: text.default(''),
  repeatSampleOn: isoDate.nullable().default(null),
});
export type NoticeDraftRequest = z.output<typeof NoticeDraftRequest>;

/** Sending needs what the authority asks for: what caused it and what was done. */
export const SendNoticeRequest = NoticeDraftRequest.extend({
  cause: text.min(3, 'Say what caused the violation, as far as it is known'),
  correctiveAction: text.min(3, 'Say what was done, or is being done, about it'),
});
export type SendNoticeRequest = z.output<typeof SendNoticeRequest>;

/** The facts of the violation, filled from the records; the notice carries them as they were. */
export interface NoticeFacts {
  company: string;
  site: string;
  siteAddress: string | null;
  permitNumber: string;
  authority: string;
  pointCode: string;
  parameter: string;
  statistic: string;
  /** The day, or the month of an average. */
  date: string;
  value: string;
  limit: number;
  unit: string;
  /** When each sample behind the figure was taken (site time). */
  sampledAt: string[];
  /** When the site became aware (site time), and from what. */
  awareAt: string | null;
  awareSource: string | null;
  /** The deadline to notify (site time). */
  dueAt: string;
}

export interface NoticeView {
  followUpId: string;
  status: 'new' | 'draft' | 'sent';
  /** The authority's address from the permit; null when the permit has none. */
  to: string | null;
  facts: NoticeFacts;
  cause: string;
  correctiveAction: string;
  repeatSampleOn: string | null;
  sentAt: string | null;
  sentByName: string | null;
  /** Sent before the deadline: null until sent. */
  onTime: boolean | null;
}
