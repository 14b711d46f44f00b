import { DateTime } from 'luxon';

/**
 * 40 CFR 262.42, exception reporting: when the signed copy of a manifest has not come back
 * from the receiving facility, counted in days from the date the initial transporter accepted
 * the waste. The e-Manifest rule (effective 22 January 2025 federally; states adopt it on their
 * own dates) moved the large quantity generator's steps from 35 / 45 days to 45 / 60 days.
 * Very small quantity generators have no such duty.
 */
/** The only papers whose signed copy 40 CFR 262.42 follows: the hazardous waste manifest. */
export const SIGNED_COPY_DOCUMENT = 'hazardous-waste-manifest';

export type GeneratorStatus = 'large' | 'small' | 'very-small';
export type ManifestRule = 'current' | 'before-2025';

export interface ManifestDeadline {
  step: 'contact-transporter-and-facility' | 'exception-report' | 'copy-with-note-of-non-receipt';
  days: number;
  dueOn: string;
  source: string;
}

const schedule: Record<
  'large' | 'small',
  Record<ManifestRule, Array<{ step: ManifestDeadline['step']; days: number; section: string }>>
> = {
  large: {
    current: [
      { step: 'contact-transporter-and-facility', days: 45, section: '262.42(a)(1)' },
      { step: 'exception-report', days: 60, section: '262.42(a)(2)' },
    ],
    'before-2025': [
      { step: 'contact-transporter-and-facility', days: 35, section: '262.42(a)(1) before 2025' },
      { step: 'exception-report', days: 45, section: '262.42(a)(2) before 2025' },
    ],
  },
  small: {
    current: [{ step: 'copy-with-note-of-non-receipt', days: 60, section: '262.42(b)' }],
    'before-2025': [{ step: 'copy-with-note-of-non-receipt', days: 60, section: '262.42(b)' }],
  },
};

export function manifestDeadlines(status: GeneratorStatus, rule: ManifestRule, acceptedOn: string): ManifestDeadline[] {
  if (status === 'very-small') return [];
  const accepted = DateTime.fromISO(acceptedOn, { zone: 'UTC' });
  return schedule[status][rule].map(({ step, days, section }) => ({
    step,
    days,
    dueOn: accepted.plus({ days }).toISODate()!,
    source: `40 CFR ${section}`,
  }));
}

/** Days from `today` to `dueOn`: positive is days left, negative is days overdue. */
export function daysLeft(dueOn: string, today: string): number {
  return Math.round(DateTime.fromISO(dueOn, { zone: 'UTC' }).diff(DateTime.fromISO(today, { zone: 'UTC' }), 'days').days);
}

/** A step is overdue once the day after its due date begins without the signed copy. */
export function isOverdue(dueOn: string, today: string): boolean {
  return daysLeft(dueOn, today) < 0;
}
