import { describe, expect, it } from 'vitest';
import {
  checkResult,
  checkSample,
  holdingTimeExceeded,
  type LimitFacts,
  type ResultFacts,
  type SampleFacts,
} from '../../server/domain/lab-checks.js';
import { convert } from '../../server/domain/units.js';

const zone = 'America/Chicago';
const sample: SampleFacts = {
  collectedAt: new Date('2026-03-02T15:00:00Z'),
  sampleType: 'grab',
  preservationConfirmed: true,
  temperatureOnReceiptC: 4,
};
const hem: ResultFacts = {
  parameterName: 'Oil and grease (HEM)',
  fraction: 'HEM',
  method: '1664B',
  qualifier: null,
  valueReported: '12.3',
  unit: 'mg/L',
  minimumLevel: 5,
  analysedAt: new Date('2026-03-05T15:00:00Z'),
};
const dailyMax: LimitFacts = { statistic: 'daily-maximum', value: 100, unit: 'mg/L', sampleType: 'grab' };
const codes = (flags: Array<{ code: string }>) => flags.map((flag) => flag.code);

describe('holding time: analysis within 28 days of collection date and time (Method 1664 Rev. B §8.5; 40 CFR 136.3 Table II)', () => {
  const collected = new Date('2026-01-05T14:30:00Z');
  it('passes one minute before 28 days', () => {
    expect(holdingTimeExceeded(collected, new Date('2026-02-02T14:29:00Z'), zone)).toBe(false);
  });
  it('passes at exactly 28 days', () => {
    expect(holdingTimeExceeded(collected, new Date('2026-02-02T14:30:00Z'), zone)).toBe(false);
  });
  it('fails one minute after 28 days', () => {
    expect(holdingTimeExceeded(collected, new Date('2026-02-02T14:31:00Z'), zone)).toBe(true);
  });
  it("counts the site's calendar days across a daylight-saving change", () => {
    // Collected 2026-02-20 09:00 CST; clocks go forward 2026-03-08. 28 days later is 2026-03-20
    // 09:00 CDT = 14:00Z, one hour earlier in UTC than 28 × 24 h.
    const winter = new Date('2026-02-20T15:00:00Z');
    expect(holdingTimeExceeded(winter, new Date('2026-03-20T14:00:00Z'), zone)).toBe(false);
    expect(holdingTimeExceeded(winter, new Date('2026-03-20T14:01:00Z'), zone)).toBe(true);
  });
  it('flags a result analysed 30 days after collection', () => {
    const late = { ...hem, analysedAt: new Date('2026-04-01T15:00:00Z') };
    expect(codes(checkResult(late, sample, [dailyMax], zone))).toContain('holding-time');
  });
});

describe('sample type (Method 1664 Rev. B §8.3; 40 CFR 403.12(g)(3))', () => {
  it('flags a field composite for oil and grease', () => {
    expect(codes(checkResult(hem, { ...sample, sampleType: 'composite' }, [dailyMax], zone))).toContain('field-composite');
  });
  it('accepts grabs composited in the laboratory', () => {
    expect(codes(checkResult(hem, { ...sample, sampleType: 'lab-composite-of-grabs' }, [dailyMax], zone))).not.toContain('field-composite');
  });
  it('flags a composite where the permit asks for grabs, for any parameter', () => {
    const tss = { ...hem, parameterName: 'TSS', fraction: null, method: 'SM 2540 D' };
    expect(codes(checkResult(tss, { ...sample, sampleType: 'composite' }, [dailyMax], zone))).toContain('field-composite');
  });
});

describe('ML and precision rules (Method 1664 Rev. B §12.3, §12.3.1)', () => {
  it('flags a value below the ML reported as a number', () => {
    expect(codes(checkResult({ ...hem, valueReported: '3.1' }, sample, [dailyMax], zone))).toContain('below-ml-as-number');
  });
  it('accepts a value at the ML', () => {
    expect(codes(checkResult({ ...hem, valueReported: '5.0' }, sample, [dailyMax], zone))).not.toContain('below-ml-as-number');
  });
  it('accepts "<5.0"', () => {
    expect(codes(checkResult({ ...hem, qualifier: '<', valueReported: '5.0' }, sample, [dailyMax], zone))).toEqual([]);
  });
  it('notes excess precision and shows the value to 3 figures at 10 mg/L and above', () => {
    const flags = checkResult({ ...hem, valueReported: '12.34' }, sample, [dailyMax], zone);
    expect(flags.find((flag) => flag.code === 'excess-precision')?.message).toContain('12.3 mg/L');
  });
  it('notes excess precision below 10 mg/L at 3 figures', () => {
    expect(codes(checkResult({ ...hem, valueReported: '8.25' }, sample, [dailyMax], zone))).toContain('excess-precision');
    expect(codes(checkResult({ ...hem, valueReported: '8.2' }, sample, [dailyMax], zone))).not.toContain('excess-precision');
  });
});

describe('limits', () => {
  it('flags strictly greater than a daily maximum, not equal (40 CFR 122.2: exceed)', () => {
    expect(codes(checkResult({ ...hem, valueReported: '100' }, sample, [dailyMax], zone))).not.toContain('over-limit');
    expect(codes(checkResult({ ...hem, valueReported: '101' }, sample, [dailyMax], zone))).toContain('over-limit');
  });
  it('converts units before comparing: 120 000 µg/L is 120 mg/L', () => {
    expect(codes(checkResult({ ...hem, valueReported: '120000', unit: 'µg/L' }, sample, [dailyMax], zone))).toContain('over-limit');
  });
  it("leaves a mass limit (lb/day) to the period summary: one result without its day's flow is no loading", () => {
    const loading = { ...dailyMax, value: 10, unit: 'lb/day' };
    expect(codes(checkResult({ ...hem, valueReported: '500' }, sample, [loading], zone))).not.toContain('over-limit');
    expect(codes(checkResult({ ...hem, valueReported: '500' }, sample, [loading], zone))).not.toContain('unit-not-convertible');
  });
  it('flags a unit that cannot be compared with the limit', () => {
    expect(codes(checkResult({ ...hem, unit: 'SU' }, sample, [dailyMax], zone))).toContain('unit-not-convertible');
  });
  it('flags pH below an instantaneous minimum', () => {
    const ph = { ...hem, parameterName: 'pH', fraction: null, method: 'SM 4500-H+ B', valueReported: '5.2', unit: 'SU' };
    const minimum: LimitFacts = { statistic: 'instantaneous-minimum', value: 5.5, unit: 'SU', sampleType: 'grab' };
    expect(codes(checkResult(ph, sample, [minimum], zone))).toEqual(['below-limit']);
  });
  it('notes a result with no limit at its point', () => {
    expect(codes(checkResult(hem, sample, [], zone))).toEqual(['no-limit']);
  });
  it('flags analysis before collection', () => {
    expect(codes(checkResult({ ...hem, analysedAt: new Date('2026-03-01T00:00:00Z') }, sample, [dailyMax], zone))).toContain(
      'analysed-before-collected',
    );
  });
});

describe('sample checks', () => {
  const now = new Date('2026-06-01T00:00:00Z');
  it('flags a sample received above 6 °C (40 CFR 136.3 Table II: ≤ 6 °C)', () => {
    expect(codes(checkSample({ ...sample, temperatureOnReceiptC: 6 }, now))).toEqual([]);
    expect(codes(checkSample({ ...sample, temperatureOnReceiptC: 6.1 }, now))).toEqual(['warm-on-receipt']);
  });
  it('flags unconfirmed preservation and a collection in the future', () => {
    expect(codes(checkSample({ ...sample, preservationConfirmed: false, collectedAt: new Date('2026-07-01T00:00:00Z') }, now))).toEqual([
      'collected-in-future',
      'preservation-not-confirmed',
    ]);
  });
});

describe('units (NIST Handbook 44: 1 US gal = 3.785411784 L exactly)', () => {
  it('converts 1 MGD to 3785.411784 m³/day', () => {
    expect(convert(1, 'MGD', 'm³/day')).toBeCloseTo(3785.411784, 6);
  });
  it('converts 212 °F to 100 °C', () => {
    expect(convert(212, '°F', '°C')).toBeCloseTo(100, 10);
  });
  it('refuses to convert mg/L to gal/day', () => {
    expect(convert(1, 'mg/L', 'gal/day')).toBeNull();
  });
});

describe('unit catalogue', () => {
  it('offers in the contracts exactly the units it can convert', async () => {
    const { limitUnitNames } = await import('../../server/contracts/unit-names.js');
    const { units } = await import('../../server/domain/units.js');
    expect([...limitUnitNames].sort()).toEqual(Object.keys(units).sort());
  });
  it('converts 1 lb/day to 0.45359237 kg/day (NIST Handbook 44, Appendix C: 1 lb = 0.453 592 37 kg exactly)', async () => {
    const { convert } = await import('../../server/domain/units.js');
    expect(convert(1, 'lb/day', 'kg/day')).toBe(0.45359237);
    expect(convert(1, 'lb/day', 'mg/L')).toBeNull();
  });
});
