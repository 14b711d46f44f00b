import { describe, expect, it } from 'vitest';
import { dayThatTookAverageOver } from '../../server/domain/period/statistics.js';

// 40 CFR 122.2: the average monthly discharge is the average of the daily discharges of the month.
// 40 CFR 403.12(g)(2): the 24 hours to notify run from when the user becomes aware of the violation,
// which for an average is the result that took it over the limit.
const days = (...values: number[]) =>
  values.map((value, i) => ({ day: `2026-02-${String(3 + 6 * i).padStart(2, '0')}`, value, allNonDetect: false }));

describe('the result that took a monthly average over its limit', () => {
  it('is the third when the first two keep the average within (8, 9, then 16 against 10: averages 8, 8.5, 11)', () => {
    expect(dayThatTookAverageOver(days(8, 9, 16), 10)).toBe('2026-02-15');
  });

  it('is the last crossing when the average dipped back within the limit before going over for good', () => {
    // Averages 20, 10.5, 7.33, 13: over, over, within, over.
    expect(dayThatTookAverageOver(days(20, 1, 1, 30), 10)).toBe('2026-02-21');
  });

  it('is none when the month ends within the limit, even if it was over on the way (equal is not over)', () => {
    // Averages 30, 15.5, 10.67, 8.25.
    expect(dayThatTookAverageOver(days(30, 1, 1, 1), 10)).toBeNull();
    expect(dayThatTookAverageOver(days(10, 10), 10)).toBeNull();
  });
});
