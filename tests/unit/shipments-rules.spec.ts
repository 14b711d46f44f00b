import { describe, expect, it } from 'vitest';
import { EPA_ID_NUMBER, MANIFEST_TRACKING_NUMBER } from '../../server/contracts/manifest-formats.js';
import { daysLeft, isOverdue, manifestDeadlines } from '../../server/domain/manifest-deadlines.js';
import { usedOilFlags, type UsedOilAnalysis } from '../../server/domain/used-oil.js';

const shipped = '2026-01-10';
const dayAfter = (days: number) => new Date(Date.UTC(2026, 0, 10 + days)).toISOString().slice(0, 10);
const stepsOverdue = (status: 'large' | 'small' | 'very-small', rule: 'current' | 'before-2025', day: number) =>
  manifestDeadlines(status, rule, shipped)
    .filter((d) => isOverdue(d.dueOn, dayAfter(day)))
    .map((d) => d.step);

describe('signed-copy deadlines (40 CFR 262.42), counted from acceptance by the initial transporter', () => {
  it('large quantity generator, current rule (e-Manifest rule, 2025): contact at 45 days, exception report at 60', () => {
    expect(stepsOverdue('large', 'current', 45)).toEqual([]);
    expect(stepsOverdue('large', 'current', 46)).toEqual(['contact-transporter-and-facility']);
    expect(stepsOverdue('large', 'current', 60)).toEqual(['contact-transporter-and-facility']);
    expect(stepsOverdue('large', 'current', 61)).toEqual(['contact-transporter-and-facility', 'exception-report']);
  });
  it('large quantity generator, rule before 2025: contact at 35 days, exception report at 45', () => {
    expect(stepsOverdue('large', 'before-2025', 35)).toEqual([]);
    expect(stepsOverdue('large', 'before-2025', 36)).toEqual(['contact-transporter-and-facility']);
    expect(stepsOverdue('large', 'before-2025', 45)).toEqual(['contact-transporter-and-facility']);
    expect(stepsOverdue('large', 'before-2025', 46)).toEqual(['contact-transporter-and-facility', 'exception-report']);
  });
  for (const rule of ['current', 'before-2025'] as const) {
    it(`small quantity generator (${rule}): a copy with a note of non-receipt at 60 days (262.42(b))`, () => {
      expect(stepsOverdue('small', rule, 59)).toEqual([]);
      expect(stepsOverdue('small', rule, 60)).toEqual([]);
      expect(stepsOverdue('small', rule, 61)).toEqual(['copy-with-note-of-non-receipt']);
    });
    it(`very small quantity generator (${rule}): no exception reporting`, () => {
      expect(manifestDeadlines('very-small', rule, shipped)).toEqual([]);
    });
  }
  it('counts days left and days overdue', () => {
    const [contact] = manifestDeadlines('large', 'current', shipped);
    expect(contact!.dueOn).toBe('2026-02-24');
    expect(daysLeft(contact!.dueOn, '2026-02-20')).toBe(4);
    expect(daysLeft(contact!.dueOn, '2026-02-27')).toBe(-3);
  });
});

describe('used oil (40 CFR 279)', () => {
  const base: UsedOilAnalysis = {
    totalHalogensPpm: null,
    burnedAsFuel: false,
    arsenicPpm: null,
    cadmiumPpm: null,
    chromiumPpm: null,
    leadPpm: null,
    flashPointF: null,
  };
  const codes = (analysis: Partial<UsedOilAnalysis>) => usedOilFlags({ ...base, ...analysis }).map((f) => f.code);

  it('presumes mixing only above 1,000 ppm total halogens: "more than" (279.10(b)(1)(ii))', () => {
    expect(codes({ totalHalogensPpm: 999 })).toEqual([]);
    expect(codes({ totalHalogensPpm: 1000 })).toEqual([]);
    expect(codes({ totalHalogensPpm: 1001 })).toEqual(['halogens-presumption']);
  });

  it.each([
    ['arsenicPpm', 5, 5.01],
    ['cadmiumPpm', 2, 2.01],
    ['chromiumPpm', 10, 10.01],
    ['leadPpm', 100, 100.1],
  ] as const)('holds %s at its 279.11 Table 1 maximum %s and flags %s', (field, edge, over) => {
    expect(codes({ burnedAsFuel: true, [field]: edge })).toEqual([]);
    expect(codes({ burnedAsFuel: true, [field]: over })).toEqual(['off-specification']);
  });

  it('needs a flash point of at least 100 °F (279.11 Table 1)', () => {
    expect(codes({ burnedAsFuel: true, flashPointF: 100 })).toEqual([]);
    expect(codes({ burnedAsFuel: true, flashPointF: 99 })).toEqual(['off-specification']);
  });

  it('allows at most 4,000 ppm total halogens in fuel (279.11 Table 1), besides the 1,000 ppm presumption', () => {
    expect(codes({ burnedAsFuel: true, totalHalogensPpm: 4000 })).toEqual(['halogens-presumption']);
    expect(codes({ burnedAsFuel: true, totalHalogensPpm: 4001 })).toEqual(['halogens-presumption', 'off-specification']);
  });

  it('does not apply the fuel specification to oil not burned as fuel', () => {
    expect(codes({ burnedAsFuel: false, leadPpm: 500 })).toEqual([]);
  });
});

describe("formats from EPA's manifest instructions (EPA Form 8700-22; 40 CFR 262.21(f)(2))", () => {
  it.each([
    ['123456789JJK', true],
    ['12345678JJK', false],
    ['123456789JJ1', false],
    ['123456789jjk', false],
    ['A23456789JJK', false],
  ])('tracking number %s → %s', (value, ok) => expect(MANIFEST_TRACKING_NUMBER.test(value)).toBe(ok));
  it.each([
    ['ILD000123456', true],
    ['IL0000123456', true],
    ['ILD00012345', false],
    ['1LD000123456', false],
    ['ild000123456', false],
  ])('EPA ID %s → %s', (value, ok) => expect(EPA_ID_NUMBER.test(value)).toBe(ok));
});
