/**
 * What a violation obliges the permittee to do, and by when.
 * Pretreatment (40 CFR 403.12(g)(2)): notify the control authority within 24 hours of becoming
 * aware of the violation, and repeat the sampling and submit the result within 30 days.
 * Direct discharge (40 CFR 122.41(l)(6)): report orally within 24 hours and in writing within
 * 5 days (for noncompliance that may endanger health or the environment; Decant opens both
 * for a daily-maximum violation and lets the coordinator close what does not apply).
 */
export interface Obligation {
  kind: 'notify-control-authority' | 'repeat-sampling' | 'report-within-24-hours' | 'written-report';
  title: string;
  dueAt: Date;
  source: string;
}

const HOUR = 3600 * 1000;
const DAY = 24 * HOUR;

export function violationObligations(permitKind: 'pretreatment' | 'npdes', statistic: string, awareAt: Date): Obligation[] {
  if (permitKind === 'pretreatment') {
    return [
      {
        kind: 'notify-control-authority',
        title: 'Notify the control authority of the violation',
        dueAt: new Date(awareAt.getTime() + 24 * HOUR),
        source: '40 CFR 403.12(g)(2)',
      },
      {
        kind: 'repeat-sampling',
        title: 'Repeat the sampling and submit the result',
        dueAt: new Date(awareAt.getTime() + 30 * DAY),
        source: '40 CFR 403.12(g)(2)',
      },
    ];
  }
  if (statistic !== 'daily-maximum') return [];
  return [
    {
      kind: 'report-within-24-hours',
      title: 'Report the noncompliance orally',
      dueAt: new Date(awareAt.getTime() + 24 * HOUR),
      source: '40 CFR 122.41(l)(6)(i)',
    },
    {
      kind: 'written-report',
      title: 'Send the written noncompliance report',
      dueAt: new Date(awareAt.getTime() + 5 * DAY),
      source: '40 CFR 122.41(l)(6)(i)',
    },
  ];
}
