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
    expect(
      reportingPeriods(
        { effectiveFrom: '2025-03-15', effectiveTo: null, reportingFrequency: 'semiannual', reportDueDays: 30 },
        '2026-02-01',
      ),
    ).toEqual([
      { startsOn: '2025-03-15', endsOn: '2025-06-30', dueOn: '2025-07-30' },
      { startsOn: '2025-07-01', endsOn: '2025-12-31', dueOn: '2026-01-30' },
      { startsOn: '2026-01-01', endsOn: '2026-06-30', dueOn: '2026-07-30' },
    ]);
  });
  it('cuts quarters and months, and stops at the permit end', () => {
    expect(
      reportingPeriods(
        { effectiveFrom: '2026-01-01', effectiveTo: '2026-05-15', reportingFrequency: 'quarterly', reportDueDays: 28 },
        '2026-12-31',
      ).map((p) => [p.startsOn, p.endsOn]),
    ).toEqual([
      ['2026-01-01', '2026-03-31'],
      ['2026-04-01', '2026-05-15'],
    ]);
    expect(
      reportingPeriods(
        { effectiveFrom: '2026-01-01', effectiveTo: null, reportingFrequency: 'monthly', reportDueDays: 15 },
        '2026-02-10',
      ).map((p) => p.dueOn),
    ).toEqual(['2026-02-15', '2026-03-15']);
  });
});

describe('late reports (40 CFR 403.8(f)(2)(viii)(F); 45 days from memory, the permit setting decides)', async () => {
  const { reportTimeliness } = await import('../../server/domain/report-timeliness.js');
  it('is significant only more than the threshold after the due date', () => {
    expect(reportTimeliness('2026-01-30', '2026-03-16', '2026-06-01', 45, 'pretreatment')).toMatchObject({
      daysLate: 45,
      significantNoncompliance: false,
    });
    expect(reportTimeliness('2026-01-30', '2026-03-17', '2026-06-01', 45, 'pretreatment')).toMatchObject({
      daysLate: 46,
      significantNoncompliance: true,
    });
    expect(reportTimeliness('2026-01-30', '2026-03-02', '2026-06-01', 30, 'pretreatment')).toMatchObject({
      daysLate: 31,
      significantNoncompliance: true,
    });
  });
  it('counts an unsent report up to today, and gives no verdict for a direct-discharge permit', () => {
    expect(reportTimeliness('2026-01-30', null, '2026-02-09', 45, 'pretreatment')).toMatchObject({
      daysLate: 10,
      significantNoncompliance: false,
    });
    expect(reportTimeliness('2026-01-30', '2026-01-20', '2026-06-01', 45, 'npdes')).toMatchObject({
      daysLate: 0,
      significantNoncompliance: null,
    });
  });
});
