import { describe, expect, it } from 'vitest';
import { violationObligations } from '../../server/domain/notification-deadlines.js';
import { reportingPeriods } from '../../server/domain/reporting-periods.js';

describe('obligations after a violation', () => {
  const aware = new Date('2026-03-04T15:00:00Z');
  it('pretreatment: notify within 24 hours, repeat sampling within 30 days (40 CFR 403.12(g)(2))', () => {
    expect(violationObligations('pretreatment', 'monthly-average', aware).map((o) => [o.kind, o.dueAt.toISOString()])).toEqual([
      ['notify-control-authority', '2026-03-05T15:00:00.000Z'],
      ['repeat-sampling', '2026-04-03T15:00:00.000Z'],
    ]);
  });
  it('direct discharge: 24-hour report and a written report within 5 days for a daily maximum (40 CFR 122.41(l)(6))', () => {
    expect(violationObligations('npdes', 'daily-maximum', aware).map((o) => [o.kind, o.dueAt.toISOString()])).toEqual([
      ['report-within-24-hours', '2026-03-05T15:00:00.000Z'],
      ['written-report', '2026-03-09T15:00:00.000Z'],
    ]);
    expect(violationObligations('npdes', 'monthly-average', aware)).toEqual([]);
  });
});

describe('reporting periods', () => {
  it('cuts semiannual periods on calendar halves, clipped to the effective date, with the due date after the end', () => {
    expect(reportingPeriods({ effectiveFrom: '2025-03-15', effectiveTo: null, reportingFrequency: 'semiannual', reportDueDays: 30 }, '2026-02-01')).toEqual([
      { startsOn: '2025-03-15', endsOn: '2025-06-30', dueOn: '2025-07-30' },
      { startsOn: '2025-07-01', endsOn: '2025-12-31', dueOn: '2026-01-30' },
      { startsOn: '2026-01-01', endsOn: '2026-06-30', dueOn: '2026-07-30' },
    ]);
  });
  it('cuts quarters and months, and stops at the permit end', () => {
    expect(reportingPeriods({ effectiveFrom: '2026-01-01', effectiveTo: '2026-05-15', reportingFrequency: 'quarterly', reportDueDays: 28 }, '2026-12-31').map((p) => [p.startsOn, p.endsOn])).toEqual([
      ['2026-01-01', '2026-03-31'], ['2026-04-01', '2026-05-15'],
    ]);
    expect(reportingPeriods({ effectiveFrom: '2026-01-01', effectiveTo: null, reportingFrequency: 'monthly', reportDueDays: 15 }, '2026-02-10').map((p) => p.dueOn)).toEqual(['2026-02-15', '2026-03-15']);
  });
});
