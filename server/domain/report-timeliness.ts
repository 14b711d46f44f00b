import { DateTime } from 'luxon';

/**
 * Is the periodic report late, and late enough to be significant noncompliance? 40 CFR
 * 403.8(f)(2)(viii)(F): a report not submitted within 45 days after its due date (from memory;
 * older local ordinances use 30 days — the permit's late-report setting decides). A report not
 * yet sent counts its lateness up to today. Direct-discharge permits get the days late only.
 */
export interface ReportTimeliness {
  dueOn: string;
  submittedOn: string | null;
  daysLate: number;
  lateReportDays: number;
  significantNoncompliance: boolean | null;
}

export function reportTimeliness(
  dueOn: string,
  submittedOn: string | null,
  today: string,
  lateReportDays: number,
  permitKind: 'pretreatment' | 'npdes',
): ReportTimeliness {
  const reference = DateTime.fromISO(submittedOn ?? today, { zone: 'UTC' });
  const daysLate = Math.max(0, Math.round(reference.diff(DateTime.fromISO(dueOn, { zone: 'UTC' }), 'days').days));
  return {
    dueOn,
    submittedOn,
    daysLate,
    lateReportDays,
    significantNoncompliance: permitKind === 'pretreatment' ? daysLate > lateReportDays : null,
  };
}
