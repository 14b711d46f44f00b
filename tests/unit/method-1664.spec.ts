import { describe, expect, it } from 'vitest';
import {
  METHOD_DETECTION_LIMIT,
  MINIMUM_LEVEL,
  acceptanceCriteria,
  allowedSignificantFigures,
  relativePercentDifference,
  significantFigures,
  spikeRecovery,
  toMethodPrecision,
} from '../../server/domain/method-1664.js';
import { checkQcBatch, type QcFacts } from '../../server/domain/lab-checks.js';

describe('EPA Method 1664 Rev. B constants', () => {
  it('has MDL 1.4 mg/L and ML 5.0 mg/L (§1.6)', () => {
    expect(METHOD_DETECTION_LIMIT).toBe(1.4);
    expect(MINIMUM_LEVEL).toBe(5.0);
  });

  it('carries Table 1 acceptance criteria for HEM and SGT-HEM', () => {
    expect(acceptanceCriteria.HEM).toEqual({
      iprPrecisionMax: 11,
      iprRecovery: { min: 83, max: 101 },
      matrixSpike: { min: 78, max: 114 },
      rpdMax: 18,
      opr: { min: 78, max: 114 },
    });
    expect(acceptanceCriteria['SGT-HEM']).toEqual({
      iprPrecisionMax: 28,
      iprRecovery: { min: 83, max: 116 },
      matrixSpike: { min: 64, max: 132 },
      rpdMax: 34,
      opr: { min: 64, max: 132 },
    });
  });
});

describe('spike recovery and RPD (Method 1664 Rev. B §9.3)', () => {
  it('computes P = 100 (A − B) / T for HEM', () => {
    // A = 42.0 mg/L found, B = 4.0 background, T = 40.0 spiked: P = 100 × 38 / 40 = 95 %.
    expect(spikeRecovery('HEM', 42, 4, 40)).toBeCloseTo(95, 10);
  });

  it('uses T / 2 as the true value for SGT-HEM, since silica gel removes the polar half of the spike', () => {
    // A = 22.0, B = 2.0, T = 40.0 → true 20.0: P = 100 × 20 / 20 = 100 %.
    expect(spikeRecovery('SGT-HEM', 22, 2, 40)).toBeCloseTo(100, 10);
  });

  it('computes RPD = 100 |D1 − D2| / mean', () => {
    // 40 and 36: |4| / 38 × 100 = 10.526…
    expect(relativePercentDifference(40, 36)).toBeCloseTo(10.5263, 3);
    expect(relativePercentDifference(36, 40)).toBeCloseTo(relativePercentDifference(40, 36), 12);
  });
});

describe('QC windows at their edges (Method 1664 Rev. B, Table 1)', () => {
  const blank: Omit<QcFacts, 'fraction'> = {
    oprRecoveryPct: null,
    msRecoveryPct: null,
    msdRecoveryPct: null,
    rpdPct: null,
    methodBlank: null,
    spike: null,
  };
  const codes = (qc: Partial<QcFacts> & { fraction: 'HEM' | 'SGT-HEM' }) => checkQcBatch({ ...blank, ...qc }).map((f) => f.code);

  it.each([
    ['HEM', 78, []],
    ['HEM', 114, []],
    ['HEM', 77.9, ['qc-opr']],
    ['HEM', 114.1, ['qc-opr']],
    ['SGT-HEM', 64, []],
    ['SGT-HEM', 132, []],
    ['SGT-HEM', 63.9, ['qc-opr']],
    ['SGT-HEM', 132.1, ['qc-opr']],
  ] as const)('%s OPR recovery %s %% → %j', (fraction, opr, expected) => {
    expect(codes({ fraction, oprRecoveryPct: opr })).toEqual(expected);
  });

  it.each([
    ['HEM', 18, []],
    ['HEM', 18.1, ['qc-rpd']],
    ['SGT-HEM', 34, []],
    ['SGT-HEM', 34.1, ['qc-rpd']],
  ] as const)('%s MS/MSD RPD %s %% → %j', (fraction, rpd, expected) => {
    expect(codes({ fraction, rpdPct: rpd })).toEqual(expected);
  });

  it.each([
    ['HEM', 78, 114, []],
    ['HEM', 77.9, 114.1, ['qc-ms-recovery', 'qc-msd-recovery']],
    ['SGT-HEM', 64, 132, []],
    ['SGT-HEM', 63.9, 132.1, ['qc-ms-recovery', 'qc-msd-recovery']],
  ] as const)('%s MS %s %% and MSD %s %% → %j', (fraction, ms, msd, expected) => {
    expect(codes({ fraction, msRecoveryPct: ms, msdRecoveryPct: msd })).toEqual(expected);
  });

  it('computes recovery and RPD from raw spike data when percentages are missing (§9.3)', () => {
    // HEM, T = 40, B = 0: MS 30 → 75 % (below 78), MSD 38 → 95 %; RPD = 8/34 = 23.5 % (above 18).
    expect(codes({ fraction: 'HEM', spike: { spiked: 40, background: 0, msFound: 30, msdFound: 38 } })).toEqual([
      'qc-ms-recovery',
      'qc-rpd',
    ]);
    // The same data as SGT-HEM: true value 20 → 150 % and 190 %, both above 132; RPD 23.5 % is within 34.
    expect(codes({ fraction: 'SGT-HEM', spike: { spiked: 40, background: 0, msFound: 30, msdFound: 38 } })).toEqual([
      'qc-ms-recovery',
      'qc-msd-recovery',
    ]);
  });
});

describe('reporting precision (Method 1664 Rev. B §12.3)', () => {
  it.each([
    ['12.3', 3],
    ['12.34', 4],
    ['8.2', 2],
    ['8.25', 3],
    ['120', 2],
    ['120.', 3],
    ['0.050', 2],
    ['12.0', 3],
    ['5', 1],
  ])('counts %s as %i significant figures', (text, expected) => {
    expect(significantFigures(text)).toBe(expected);
  });

  it('allows 3 significant figures at 10 mg/L and above, 2 below', () => {
    expect(allowedSignificantFigures(10)).toBe(3);
    expect(allowedSignificantFigures(9.99)).toBe(2);
  });

  it.each([
    [12.34, '12.3'],
    [8.25, '8.3'],
    [9.87, '9.9'],
    [12, '12.0'],
    [1234, '1230'],
    [6.1, '6.1'],
  ])('shows %s mg/L as %s', (value, shown) => {
    expect(toMethodPrecision(value)).toBe(shown);
  });
});
