import { describe, expect, it } from 'vitest';
import { compilePeriod } from '../../server/domain/period/period-summary.js';
import { revisionChanges } from '../../server/domain/period/revision-changes.js';
import type { LimitInput, Measurement, PeriodInput } from '../../server/domain/period/types.js';

const limit = (value: number, extra: Partial<LimitInput> = {}): LimitInput => ({
  id: `L-${value}`,
  dischargePointId: 'P1',
  pointCode: 'OF-001',
  parameterId: 'OG',
  parameterName: 'Oil and grease',
  sncReviewFactor: 1.4,
  isPollutant: true,
  method1664: true,
  reportedDecimals: null,
  statistic: 'daily-maximum',
  value,
  unit: 'mg/L',
  frequencyCount: 2,
  frequencyPer: 'month',
  appliesFrom: '2000-01-01',
  appliesTo: null,
  ...extra,
});
let n = 0;
const m = (day: string, value: number, extra: Partial<Measurement> = {}): Measurement => ({
  resultId: `R${++n}`,
  certificateId: `C${n}`,
  dischargePointId: 'P1',
  parameterId: 'OG',
  day,
  qualifier: null,
  value,
  mdl: 1.4,
  ml: 5,
  ...extra,
});
const input = (limits: LimitInput[], measurements: Measurement[], permit: Partial<PeriodInput['permit']> = {}): PeriodInput => ({
  permit: {
    kind: 'pretreatment',
    nonDetectPolicy: 'zero',
    massLoadingFactor: 8.34,
    dailyMaxAppliesToEachGrab: false,
    sncWindow: 'calendar-halves',
    monitoringCounts: 'sampling-days',
    ...permit,
  },
  period: { start: '2026-01-01', end: '2026-03-31' },
  limits,
  measurements,
  flows: [],
});

describe('effective-dated limits', () => {
  // A limit of 50 mg/L until Feb 14, then 30 mg/L from Feb 15. Days before the change are held to
  // the old value, days after to the new one; the period shows both versions (invented fixture).
  const old = limit(50, { id: 'v1', appliesTo: '2026-02-14' });
  const next = limit(30, { id: 'v2', appliesFrom: '2026-02-15' });
  const summary = compilePeriod(input([old, next], [m('2026-01-10', 40), m('2026-02-10', 45), m('2026-02-20', 40), m('2026-03-05', 20)]));

  it('shows one row per version in force during the period, each over its own days', () => {
    expect(summary.rows.map((r) => [r.limitId, r.appliesFrom, r.appliesTo, r.limitValue])).toEqual([
      ['v1', '2026-01-01', '2026-02-14', 50],
      ['v2', '2026-02-15', '2026-03-31', 30],
    ]);
  });

  it('judges each day against the version in force on it', () => {
    const [before, after] = summary.rows;
    // 40 and 45 were within 50; 40 on Feb 20 is over 30; 20 on Mar 5 is within.
    expect(before!.exceeded).toBe(false);
    expect(before!.dailyValues.map((d) => d.day)).toEqual(['2026-01-10', '2026-02-10']);
    expect(after!.exceedances.map((e) => [e.date, e.value])).toEqual([['2026-02-20', 40]]);
  });

  it('holds a measurement to the version of its day in the significant-noncompliance count (40 CFR 403.8(f)(2)(viii))', () => {
    const verdict = summary.significantNoncompliance![0]!;
    expect(verdict.measurements).toBe(4);
    expect(verdict.exceeding).toBe(1);
  });

  it('leaves out a version not in force during the period', () => {
    const ended = limit(10, { id: 'v0', appliesFrom: '2020-01-01', appliesTo: '2025-12-31' });
    expect(
      compilePeriod(input([ended, limit(50, { appliesFrom: '2026-01-01' })], [m('2026-01-10', 40)])).rows.map((r) => r.limitId),
    ).toEqual(['L-50']);
  });
});

describe('monitoring counts sampling days', () => {
  // Common practice, no published source: two grabs on one day are one sampling event for a
  // "2 per month" frequency. A permit may count every sample instead (a permit setting).
  const grabs = [
    m('2026-01-05', 20),
    m('2026-01-05', 22),
    m('2026-02-03', 20),
    m('2026-02-17', 20),
    m('2026-03-02', 20),
    m('2026-03-16', 20),
  ];
  it('counts two grabs on one day once, so January misses a sampling day', () => {
    const row = compilePeriod(input([limit(50)], grabs)).rows[0]!;
    expect(row.samplesTaken).toBe(5);
    expect(row.missedMonitoring).toEqual([{ unit: '2026-01', taken: 1, required: 2 }]);
  });
  it('counts every sample when the permit says so', () => {
    const row = compilePeriod(input([limit(50)], grabs, { monitoringCounts: 'samples' })).rows[0]!;
    expect(row.samplesTaken).toBe(6);
    expect(row.missedMonitoring).toEqual([]);
  });
});

describe('below the minimum level (EPA Method 1664 Rev. B §12.3.1)', () => {
  // §12.3.1: a result below the ML is reported as "<5.0 mg/L"; the summary counts it as reported.
  it('counts a detected 3.2 mg/L as <ML, not as 3.2', () => {
    const summary = compilePeriod(input([limit(50, { statistic: 'monthly-average' })], [m('2026-01-10', 3.2), m('2026-01-20', 3.8)]));
    const row = summary.rows[0]!;
    expect(row.dailyValues.map((d) => d.value)).toEqual(['<ML', '<ML']);
    expect(row.computedValue).toBe('<ML');
  });
  it('uses the lab-reported ML where it is lower than the method’s', () => {
    const row = compilePeriod(input([limit(50)], [m('2026-01-10', 3.2, { ml: 2 })])).rows[0]!;
    expect(row.computedValue).toBe(3.2);
  });
  it('leaves a parameter not measured by Method 1664 as measured', () => {
    const row = compilePeriod(input([limit(50, { method1664: false })], [m('2026-01-10', 3.2)])).rows[0]!;
    expect(row.computedValue).toBe(3.2);
  });
});

describe("a grab over on a day whose discharge is within (40 CFR 122.2 'daily discharge')", () => {
  it('says so on the row, as the certificate flags that grab', () => {
    // Grabs of 70 and 20 on one day: the day's discharge is 45, within a daily maximum of 50.
    const row = compilePeriod(input([limit(50)], [m('2026-01-10', 70), m('2026-01-10', 20)])).rows[0]!;
    expect(row.exceeded).toBe(false);
    expect(row.grabsOverOnCompliantDays).toEqual([{ day: '2026-01-10', grabValue: 70, dayValue: 45 }]);
  });
});

describe('what changed between revisions', () => {
  it('lists values, verdicts and exceedances added or removed', () => {
    const before = compilePeriod(input([limit(50)], [m('2026-01-10', 60)]));
    const after = compilePeriod(input([limit(50)], [m('2026-01-10', 40)]));
    const changes = revisionChanges(before, after);
    expect(changes.values).toEqual([expect.objectContaining({ before: '60.0', after: '40.0' })]);
    expect(changes.verdicts).toEqual([expect.objectContaining({ before: 'over the limit', after: 'within the limit' })]);
    expect(changes.exceedancesRemoved).toEqual([expect.objectContaining({ date: '2026-01-10', value: '60.0' })]);
    expect(changes.exceedancesAdded).toEqual([]);
    expect(revisionChanges(after, after)).toEqual({ values: [], verdicts: [], exceedancesAdded: [], exceedancesRemoved: [] });
  });
});
