import { DateTime } from 'luxon';
import type { SncVerdict } from '../../contracts/periods.js';
import type { ToLimitUnit } from './limit-units.js';
import type { LimitInput, Measurement } from './types.js';

/**
 * 40 CFR 403.8(f)(2)(viii), significant noncompliance of an industrial user, per pollutant
 * parameter and six-month period:
 * (A) chronic: 66 % or more of all measurements exceed (by any magnitude) a numeric limit,
 *     instantaneous limits included;
 * (B) technical review criteria: 33 % or more of all measurements equal or exceed the limit
 *     times 1.4 for BOD, TSS, fats, oil and grease, or 1.2 for other pollutants; pH excluded.
 */
export const CHRONIC_PERCENT = 66;
export const TECHNICAL_REVIEW_PERCENT = 33;

export type { SncVerdict };

/** The six-month windows that touch the period: calendar halves, or the six months ending with it. */
export function sncWindows(
  period: { start: string; end: string },
  kind: 'calendar-halves' | 'rolling',
): Array<{ start: string; end: string }> {
  const end = DateTime.fromISO(period.end, { zone: 'UTC' });
  // Rolling: the six calendar months ending with the period's last month.
  if (kind === 'rolling') return [{ start: end.startOf('month').minus({ months: 5 }).toISODate()!, end: period.end }];
  const windows: Array<{ start: string; end: string }> = [];
  let cursor = DateTime.fromISO(period.start, { zone: 'UTC' });
  while (cursor <= end) {
    const start = cursor.set({ month: cursor.month <= 6 ? 1 : 7, day: 1 });
    const windowEnd = start.plus({ months: 6 }).minus({ days: 1 });
    windows.push({ start: start.toISODate()!, end: windowEnd.toISODate()! });
    cursor = windowEnd.plus({ days: 1 });
  }
  return windows;
}

type Judge = Array<{ limit: LimitInput; scale: ToLimitUnit; isMaximum: boolean }>;

/** The verdict for one parameter in one window, from every single measurement against its point's limits. */
export function sncVerdict(
  parameter: { id: string; name: string; reviewFactor: number | null },
  window: { start: string; end: string },
  measurements: Measurement[],
  limitsByPoint: Map<string, LimitInput[]>,
  scaleFor: (limit: LimitInput) => ToLimitUnit = () => (value) => value,
): SncVerdict {
  // The limits a single measurement is held to: daily and instantaneous maxima, instantaneous minima.
  const judges = new Map<string, Judge>();
  const judgeAt = (pointId: string): Judge => {
    let judge = judges.get(pointId);
    if (!judge) {
      judge = (limitsByPoint.get(pointId) ?? [])
        .filter((l) => l.parameterId === parameter.id && l.statistic !== 'monthly-average')
        .map((limit) => ({ limit, scale: scaleFor(limit), isMaximum: limit.statistic !== 'instantaneous-minimum' }));
      judges.set(pointId, judge);
    }
    return judge;
  };
  let exceeding = 0;
  let atOrAbove = 0;
  let counted = 0;
  for (const m of measurements) {
    if (m.parameterId !== parameter.id || m.day < window.start || m.day > window.end) continue;
    let held = false;
    let over = false;
    let atReviewLevel = false;
    for (const { limit, scale, isMaximum } of judgeAt(m.dischargePointId)) {
      // Each measurement is held to the version of the limit in force on its day.
      if (m.day < limit.appliesFrom || (limit.appliesTo !== null && m.day > limit.appliesTo)) continue;
      const value = scale(m.value, m.day);
      if (value === null) continue;
      held = true;
      if (m.qualifier === '<') continue;
      if (isMaximum ? value > limit.value : value < limit.value) over = true;
      if (isMaximum && parameter.reviewFactor !== null && value >= limit.value * parameter.reviewFactor) atReviewLevel = true;
    }
    if (!held) continue;
    counted += 1;
    if (over) exceeding += 1;
    if (atReviewLevel) atOrAbove += 1;
  }
  // Whole-number comparison, so exactly 66 % (say 33 of 50) is not lost to rounding.
  const atLeast = (n: number, percent: number) => counted > 0 && n * 100 >= percent * counted;
  return {
    parameterId: parameter.id,
    parameterName: parameter.name,
    window,
    measurements: counted,
    exceeding,
    chronic: atLeast(exceeding, CHRONIC_PERCENT),
    reviewFactor: parameter.reviewFactor,
    atOrAboveReviewLevel: parameter.reviewFactor === null ? null : atOrAbove,
    technicalReview: parameter.reviewFactor === null ? null : atLeast(atOrAbove, TECHNICAL_REVIEW_PERCENT),
  };
}
