import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compilePeriod } from '../../server/domain/period/period-summary.js';
import { sncVerdict, sncWindows } from '../../server/domain/period/significant-noncompliance.js';
import type { LimitInput, Measurement, PeriodInput } from '../../server/domain/period/types.js';

const limit = (statistic: LimitInput['statistic'], value: number, extra: Partial<LimitInput> = {}): LimitInput => ({
  id: `L-${statistic}`,
  dischargePointId: 'P1',
  pointCode: 'OF-001',
  parameterId: 'OG',
  parameterName: 'Oil and grease',
  sncReviewFactor: 1.4,
  isPollutant: true,
  method1664: true,
  reportedDecimals: null,
  statistic,
  value,
  unit: 'mg/L',
  frequencyCount: 2,
  frequencyPer: 'month',
  appliesFrom: '2000-01-01',
  appliesTo: null,
  ...extra,
});
let counter = 0;
const m = (day: string, value: number, extra: Partial<Measurement> = {}): Measurement => ({
  resultId: `R${++counter}`,
  certificateId: `C${counter}`,
  dischargePointId: 'P1',
  parameterId: 'OG',
  day,
  qualifier: null,
  value,
  mdl: 1.4,
  ml: 5,
  ...extra,
});
const nd = (day: string) => m(day, 5, { qualifier: '<', mdl: 1.4, ml: 5 });
const input = (limits: LimitInput[], measurements: Measurement[], extra: Partial<PeriodInput> = {}): PeriodInput => ({
  permit: {
    kind: 'pretreatment',
    nonDetectPolicy: 'zero',
    massLoadingFactor: 8.34,
    dailyMaxAppliesToEachGrab: false,
    sncWindow: 'calendar-halves',
    monitoringCounts: 'samples',
  },
  period: { start: '2026-01-01', end: '2026-03-31' },
  limits,
  measurements,
  flows: [],
  ...extra,
});
const row = (summary: ReturnType<typeof compilePeriod>, statistic: string) => summary.rows.find((r) => r.statistic === statistic)!;

describe('daily discharges and statistics (40 CFR 122.2)', () => {
  it('averages several grabs of one day into one daily discharge, and the daily maximum takes the highest day', () => {
    // Jan 5: grabs 40, 60, 80 → daily discharge 60. Jan 20: 70. Daily maximum = 70, not the 80 grab.
    const summary = compilePeriod(
      input([limit('daily-maximum', 75)], [m('2026-01-05', 40), m('2026-01-05', 60), m('2026-01-05', 80), m('2026-01-20', 70)]),
    );
    const daily = row(summary, 'daily-maximum');
    expect(daily.dailyValues.map((d) => d.value)).toEqual([60, 70]);
    expect(daily.computedValue).toBe(70);
    expect(daily.exceeded).toBe(false);
  });

  it('applies the daily maximum to each grab when the permit says so', () => {
    const summary = compilePeriod(
      input([limit('daily-maximum', 75)], [m('2026-01-05', 40), m('2026-01-05', 80)], {
        permit: {
          kind: 'pretreatment',
          nonDetectPolicy: 'zero',
          massLoadingFactor: 8.34,
          dailyMaxAppliesToEachGrab: true,
          sncWindow: 'calendar-halves',
          monitoringCounts: 'samples',
        },
      }),
    );
    expect(row(summary, 'daily-maximum').exceedances.map((e) => e.value)).toEqual([80]);
  });

  it('averages the daily discharges of each calendar month, not the raw samples', () => {
    // January: day 1 has grabs 10 and 30 (daily 20), day 2 has 50 → (20 + 50) / 2 = 35, where
    // the mean of raw samples would be 30. February: one sample of 12 → 12.
    const summary = compilePeriod(
      input([limit('monthly-average', 30)], [m('2026-01-01', 10), m('2026-01-01', 30), m('2026-01-02', 50), m('2026-02-10', 12)]),
    );
    const monthly = row(summary, 'monthly-average');
    expect(monthly.monthlyValues.map(({ month, value, exceeded }) => [month, value, exceeded])).toEqual([
      ['2026-01', 35, true],
      ['2026-02', 12, false],
    ]);
    expect(monthly.computedValue).toBe(35);
    expect(monthly.exceedances).toHaveLength(1);
    expect(monthly.exceedances[0]).toMatchObject({ date: '2026-01', percentOver: 16.7 });
  });

  it('counts a sample by the local day it was taken: 23:30 in Chicago is the next day in UTC, but the same local day', () => {
    // The caller gives local days; two samples on local 2026-01-31 (one at 23:30 CST = 05:30Z Feb 1) stay in January.
    const summary = compilePeriod(input([limit('monthly-average', 100)], [m('2026-01-31', 20), m('2026-01-31', 40)]));
    expect(row(summary, 'monthly-average').monthlyValues).toEqual([
      { month: '2026-01', value: 30, shownValue: '30.0', days: 1, exceeded: false },
    ]);
  });

  it('treats "exceed" as strictly greater', () => {
    expect(row(compilePeriod(input([limit('daily-maximum', 100)], [m('2026-01-05', 100)])), 'daily-maximum').exceeded).toBe(false);
    expect(row(compilePeriod(input([limit('daily-maximum', 100)], [m('2026-01-05', 100.1)])), 'daily-maximum').exceeded).toBe(true);
  });

  it('uses single measurements for instantaneous limits (pH)', () => {
    const ph = { parameterId: 'PH', parameterName: 'pH', sncReviewFactor: null, unit: 'SU' };
    const summary = compilePeriod(
      input(
        [limit('instantaneous-minimum', 5.5, ph), limit('instantaneous-maximum', 10.5, ph)],
        [m('2026-01-05', 7.0, { parameterId: 'PH' }), m('2026-01-05', 5.2, { parameterId: 'PH' })],
      ),
    );
    expect(row(summary, 'instantaneous-minimum')).toMatchObject({ computedValue: 5.2, exceeded: true });
    // Hand-worked: (5.5 − 5.2) / 5.5 = 5.45 % below the minimum, stated as a distance past the limit.
    expect(row(summary, 'instantaneous-minimum').exceedances).toEqual([expect.objectContaining({ value: 5.2, percentOver: 5.5 })]);
    expect(row(summary, 'instantaneous-maximum')).toMatchObject({ computedValue: 7.0, exceeded: false });
  });
});

describe('non-detects', () => {
  it.each([
    ['zero', 5],
    ['mdl', 5.7],
    ['ml', 7.5],
    ['half-mdl', 5.35],
  ] as const)('enter a monthly average as %s (day values 10 and ND → %s)', (policy, expected) => {
    const summary = compilePeriod(
      input([limit('monthly-average', 50)], [m('2026-01-05', 10), nd('2026-01-20')], {
        permit: {
          kind: 'pretreatment',
          nonDetectPolicy: policy,
          massLoadingFactor: 8.34,
          dailyMaxAppliesToEachGrab: false,
          sncWindow: 'calendar-halves',
          monitoringCounts: 'samples',
        },
      }),
    );
    expect(row(summary, 'monthly-average').computedValue).toBeCloseTo(expected, 10);
    expect(summary.nonDetectPolicy).toBe(policy);
  });
  it("fall back to Method 1664's MDL of 1.4 mg/L (§1.6) for oil and grease, and to the reported limit for another parameter, when no MDL is reported", () => {
    const mdlPolicy = {
      permit: {
        kind: 'pretreatment' as const,
        nonDetectPolicy: 'mdl' as const,
        massLoadingFactor: 8.34,
        dailyMaxAppliesToEachGrab: false,
        sncWindow: 'calendar-halves' as const,
        monitoringCounts: 'samples' as const,
      },
    };
    const withoutMdl = (extra: Partial<Measurement> = {}) => m('2026-01-20', 2, { qualifier: '<', mdl: null, ml: null, ...extra });
    const og = compilePeriod(input([limit('monthly-average', 50)], [m('2026-01-05', 10), withoutMdl()], mdlPolicy));
    expect(row(og, 'monthly-average').monthlyValues[0]!.value).toBeCloseTo((10 + 1.4) / 2, 10);
    const zinc = { parameterId: 'ZN', parameterName: 'Zinc', sncReviewFactor: 1.2, method1664: false };
    const other = compilePeriod(
      input(
        [limit('monthly-average', 50, zinc)],
        [m('2026-01-05', 10, { parameterId: 'ZN' }), withoutMdl({ parameterId: 'ZN' })],
        mdlPolicy,
      ),
    );
    expect(row(other, 'monthly-average').monthlyValues[0]!.value).toBeCloseTo((10 + 2) / 2, 10);
  });

  it('report a statistic whose inputs are all non-detects as "<ML"', () => {
    const summary = compilePeriod(input([limit('monthly-average', 50), limit('daily-maximum', 100)], [nd('2026-01-05'), nd('2026-01-20')]));
    expect(row(summary, 'monthly-average').computedValue).toBe('<ML');
    expect(row(summary, 'daily-maximum').computedValue).toBe('<ML');
    expect(row(summary, 'daily-maximum').exceeded).toBe(false);
  });
});

describe('mass loading (operator formula: lb/day = MGD × mg/L × 8.34)', () => {
  it('computes lb/day and kg/day for a day with a flow reading', () => {
    // Hand-worked: 0.05 MGD × 40 mg/L × 8.34 = 16.68 lb/day; 0.05 MGD = 189.2705892 m³/day × 40 / 1000 = 7.570823568 kg/day.
    const summary = compilePeriod(
      input([limit('daily-maximum', 100)], [m('2026-01-05', 40)], { flows: [{ dischargePointId: 'P1', day: '2026-01-05', mgd: 0.05 }] }),
    );
    const loading = row(summary, 'daily-maximum').dailyValues[0]!.massLoading!;
    expect(loading.lbPerDay).toBeCloseTo(16.68, 10);
    expect(loading.kgPerDay).toBeCloseTo(7.570823568, 9);
  });
});

describe('mass limits (40 CFR 122.2 "daily discharge": the total mass over the day; lb/day = MGD × mg/L × 8.34)', () => {
  const flow = (day: string, mgd: number) => ({ dischargePointId: 'P1', day, mgd });
  const lb = (statistic: LimitInput['statistic'], value: number) => limit(statistic, value, { id: `L-${statistic}-lb`, unit: 'lb/day' });

  it("turns the day's concentration into a loading with that day's flow, and compares the loading to the limit", () => {
    // Hand-worked: 0.05 MGD × 40 mg/L × 8.34 = 16.68 lb/day (under 20); 0.05 × 50 × 8.34 = 20.85 lb/day (over 20, by 4.25 %).
    const summary = compilePeriod(
      input([lb('daily-maximum', 20)], [m('2026-01-05', 40), m('2026-01-06', 50)], {
        flows: [flow('2026-01-05', 0.05), flow('2026-01-06', 0.05)],
      }),
    );
    const r = row(summary, 'daily-maximum');
    expect(r.dailyValues.map((d) => d.value)).toEqual([expect.closeTo(16.68, 10), expect.closeTo(20.85, 10)]);
    expect(r.computedValue).toBeCloseTo(20.85, 10);
    expect(r.exceedances).toEqual([expect.objectContaining({ date: '2026-01-06', percentOver: 4.3, limit: 20 })]);
    expect(r.exceeded).toBe(true);
  });

  it('averages the daily loadings of a month (not the concentrations) for a monthly average', () => {
    // Hand-worked: 0.05 × 40 × 8.34 = 16.68 and 0.10 × 30 × 8.34 = 25.02 lb/day; (16.68 + 25.02) / 2 = 20.85 lb/day.
    // The mean concentration (35 mg/L) times the mean flow (0.075 MGD) would give 21.89: not the definition.
    const summary = compilePeriod(
      input([lb('monthly-average', 25)], [m('2026-01-05', 40), m('2026-01-06', 30)], {
        flows: [flow('2026-01-05', 0.05), flow('2026-01-06', 0.1)],
      }),
    );
    expect(row(summary, 'monthly-average').monthlyValues[0]!.value).toBeCloseTo(20.85, 10);
  });

  it('gives kg/day as m³/day × mg/L / 1000', () => {
    // Hand-worked: 0.05 MGD = 189.2705892 m³/day (1 gal = 3.785411784 L, NIST Handbook 44) × 40 mg/L / 1000 = 7.570823568 kg/day.
    const summary = compilePeriod(
      input([limit('daily-maximum', 10, { unit: 'kg/day' })], [m('2026-01-05', 40)], { flows: [flow('2026-01-05', 0.05)] }),
    );
    expect(row(summary, 'daily-maximum').computedValue).toBeCloseTo(7.570823568, 9);
  });

  it("uses the permit's factor when it says 8.3454", () => {
    const summary = compilePeriod(
      input([lb('daily-maximum', 100)], [m('2026-01-05', 40)], {
        flows: [flow('2026-01-05', 0.05)],
        permit: {
          kind: 'pretreatment',
          nonDetectPolicy: 'zero',
          massLoadingFactor: 8.3454,
          dailyMaxAppliesToEachGrab: false,
          sncWindow: 'calendar-halves',
          monitoringCounts: 'samples',
        },
      }),
    );
    // Hand-worked: 0.05 × 40 × 8.3454 = 16.6908 lb/day.
    expect(row(summary, 'daily-maximum').computedValue).toBeCloseTo(16.6908, 10);
  });

  it('names the sampled days without a flow reading instead of guessing their loading', () => {
    const summary = compilePeriod(
      input([lb('daily-maximum', 20)], [m('2026-01-05', 40), m('2026-01-06', 900)], { flows: [flow('2026-01-05', 0.05)] }),
    );
    const r = row(summary, 'daily-maximum');
    expect(r.daysWithoutFlow).toEqual(['2026-01-06']);
    expect(r.dailyValues.map((d) => d.day)).toEqual(['2026-01-05']);
    expect(r.exceeded).toBe(false);
    expect(r.samplesTaken).toBe(2);
  });

  it("holds each measurement's loading to the mass limit for significant noncompliance (40 CFR 403.8(f)(2)(viii)(A))", () => {
    // Two of three loadings over 20 lb/day: 0.05 × 50 × 8.34 = 20.85 and 0.05 × 60 × 8.34 = 25.02; 0.05 × 40 × 8.34 = 16.68 is under.
    const summary = compilePeriod(
      input([lb('daily-maximum', 20)], [m('2026-01-05', 40), m('2026-01-06', 50), m('2026-01-07', 60)], {
        flows: [flow('2026-01-05', 0.05), flow('2026-01-06', 0.05), flow('2026-01-07', 0.05)],
      }),
    );
    expect(summary.significantNoncompliance![0]).toMatchObject({ measurements: 3, exceeding: 2, chronic: true });
  });
});

describe('shown precision (raw values kept)', () => {
  it('shows oil and grease as EPA Method 1664 Rev. B §12.3 says: three significant figures at 10 mg/L and above, two below', () => {
    const high = row(compilePeriod(input([limit('daily-maximum', 100)], [m('2026-01-05', 12.345)])), 'daily-maximum');
    expect([high.computedValue, high.shownValue]).toEqual([12.345, '12.3']);
    const low = row(compilePeriod(input([limit('daily-maximum', 100)], [m('2026-01-05', 9.876)])), 'daily-maximum');
    expect([low.computedValue, low.shownValue]).toEqual([9.876, '9.9']);
    expect(high.precision).toMatch(/1664.*12\.3/);
  });

  it('shows pH to 0.1 unit and other figures to three significant figures (common practice, no published source)', () => {
    const ph = { parameterId: 'PH', parameterName: 'pH', sncReviewFactor: null, method1664: false, unit: 'SU' };
    const phRow = row(
      compilePeriod(input([limit('instantaneous-maximum', 10.5, ph)], [m('2026-01-05', 7.34, { parameterId: 'PH' })])),
      'instantaneous-maximum',
    );
    expect(phRow.shownValue).toBe('7.3');
    const loading = compilePeriod(
      input([limit('daily-maximum', 100, { unit: 'lb/day', method1664: true })], [m('2026-01-05', 40)], {
        flows: [{ dischargePointId: 'P1', day: '2026-01-05', mgd: 0.05 }],
      }),
    );
    expect(row(loading, 'daily-maximum').shownValue).toBe('16.7');
  });

  it("shows the decimal places the permit asks for, before the method's rule", () => {
    const r = row(compilePeriod(input([limit('daily-maximum', 100, { reportedDecimals: 2 })], [m('2026-01-05', 12.345)])), 'daily-maximum');
    expect([r.computedValue, r.shownValue, r.precision]).toEqual([12.345, '12.35', 'The permit: 2 decimal places']);
  });

  it('shows an all-non-detect statistic as "<ML" in both fields', () => {
    const r = row(compilePeriod(input([limit('daily-maximum', 100)], [nd('2026-01-05')])), 'daily-maximum');
    expect([r.computedValue, r.shownValue]).toEqual(['<ML', '<ML']);
  });
});

describe('missed monitoring', () => {
  it('counts samples per month against "2 per month" and names the short months', () => {
    const summary = compilePeriod(
      input(
        [limit('daily-maximum', 100)],
        [m('2026-01-05', 1), m('2026-01-20', 1), m('2026-02-05', 1), m('2026-03-03', 1), m('2026-03-17', 1)],
      ),
    );
    const r = row(summary, 'daily-maximum');
    expect([r.samplesTaken, r.samplesRequired]).toEqual([5, 6]);
    expect(r.missedMonitoring).toEqual([{ unit: '2026-02', taken: 1, required: 2 }]);
  });
});

describe('significant noncompliance (40 CFR 403.8(f)(2)(viii))', () => {
  const window = { start: '2026-01-01', end: '2026-06-30' };
  const limits = new Map([['P1', [limit('daily-maximum', 100)]]]);
  const series = (over: number, total: number, overValue = 101) =>
    Array.from({ length: total }, (_, i) =>
      m(`2026-0${1 + (i % 6)}-${String(1 + Math.floor(i / 6)).padStart(2, '0')}`, i < over ? overValue : 50),
    );
  const og = { id: 'OG', name: 'Oil and grease', reviewFactor: 1.4 };

  it('is chronic at exactly 66 % of measurements over the limit (33 of 50), not just under (32 of 50)', () => {
    expect(sncVerdict(og, window, series(33, 50), limits)).toMatchObject({ measurements: 50, exceeding: 33, chronic: true });
    expect(sncVerdict(og, window, series(32, 50), limits)).toMatchObject({ exceeding: 32, chronic: false });
  });

  it('meets the technical review criteria at exactly 33 % at or above limit × 1.4 for oil and grease (140 mg/L), not just under', () => {
    expect(sncVerdict(og, window, series(33, 100, 140), limits)).toMatchObject({ atOrAboveReviewLevel: 33, technicalReview: true });
    expect(sncVerdict(og, window, series(32, 100, 140), limits)).toMatchObject({ atOrAboveReviewLevel: 32, technicalReview: false });
    expect(sncVerdict(og, window, series(33, 100, 139.9), limits)).toMatchObject({ atOrAboveReviewLevel: 0, technicalReview: false });
  });

  it('uses limit × 1.2 for other pollutants', () => {
    const other = { id: 'OG', name: 'Zinc', reviewFactor: 1.2 };
    expect(sncVerdict(other, window, series(33, 100, 120), limits)).toMatchObject({ technicalReview: true });
    expect(sncVerdict(other, window, series(33, 100, 119.9), limits)).toMatchObject({ technicalReview: false });
  });

  it('leaves pH out of the technical review criteria but not out of chronic', () => {
    const ph = { id: 'OG', name: 'pH', reviewFactor: null };
    expect(sncVerdict(ph, window, series(40, 50, 200), limits)).toMatchObject({
      technicalReview: null,
      atOrAboveReviewLevel: null,
      chronic: true,
    });
  });

  it('splits the year into calendar halves, or takes the six months ending with the period', () => {
    expect(sncWindows({ start: '2026-04-01', end: '2026-09-30' }, 'calendar-halves')).toEqual([
      { start: '2026-01-01', end: '2026-06-30' },
      { start: '2026-07-01', end: '2026-12-31' },
    ]);
    expect(sncWindows({ start: '2026-07-01', end: '2026-09-30' }, 'rolling')).toEqual([{ start: '2026-04-01', end: '2026-09-30' }]);
  });

  it('gives no verdict for a direct-discharge permit', () => {
    const summary = compilePeriod(
      input([limit('daily-maximum', 100)], [m('2026-01-05', 500)], {
        permit: {
          kind: 'npdes',
          nonDetectPolicy: 'zero',
          massLoadingFactor: 8.34,
          dailyMaxAppliesToEachGrab: false,
          sncWindow: 'calendar-halves',
          monitoringCounts: 'samples',
        },
      }),
    );
    expect(summary.significantNoncompliance).toBeNull();
    expect(row(summary, 'daily-maximum').exceeded).toBe(true);
  });
});

describe('properties (fast-check)', () => {
  const day = fc.integer({ min: 1, max: 28 }).map((d) => `2026-01-${String(d).padStart(2, '0')}`);
  const sample = fc.record({ day, value: fc.double({ min: 0, max: 500, noNaN: true }) });

  it('puts a monthly average between the lowest and the highest daily discharge of the month', () => {
    fc.assert(
      fc.property(fc.array(sample, { minLength: 1, maxLength: 40 }), (samples) => {
        const summary = compilePeriod(
          input(
            // Not a Method 1664 parameter: every value is counted as measured (none is "<ML").
            [limit('monthly-average', 50, { method1664: false })],
            samples.map((s) => m(s.day, s.value)),
          ),
        );
        const r = row(summary, 'monthly-average');
        const dailies = r.dailyValues.map((d) => d.value as number);
        const average = r.monthlyValues[0]!.value as number;
        return average >= Math.min(...dailies) - 1e-9 && average <= Math.max(...dailies) + 1e-9;
      }),
    );
  });

  it('never creates an exceedance by adding a result below every limit', () => {
    fc.assert(
      fc.property(
        fc.array(sample, { minLength: 1, maxLength: 30 }),
        day,
        fc.double({ min: 0, max: 9.99, noNaN: true }),
        (samples, extraDay, low) => {
          const limits = [limit('daily-maximum', 100), limit('monthly-average', 10)];
          const before = compilePeriod(
            input(
              limits,
              samples.map((s) => m(s.day, s.value)),
            ),
          );
          const after = compilePeriod(input(limits, [...samples.map((s) => m(s.day, s.value)), m(extraDay, low)]));
          return after.rows.every((r, i) => r.exceedances.length <= before.rows[i]!.exceedances.length);
        },
      ),
    );
  });

  it('compiles the same input to the same summary', () => {
    fc.assert(
      fc.property(fc.array(sample, { maxLength: 30 }), (samples) => {
        const data = input(
          [limit('daily-maximum', 100), limit('monthly-average', 50)],
          samples.map((s) => m(s.day, s.value)),
        );
        return JSON.stringify(compilePeriod(data)) === JSON.stringify(compilePeriod(structuredClone(data)));
      }),
    );
  });
});
