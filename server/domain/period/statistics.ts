import { figureOf } from './daily-discharges.js';
import type { Figure } from './types.js';

/** A daily discharge as the statistics see it: in the limit's unit. */
export interface DayFigure {
  day: string;
  value: number;
  allNonDetect: boolean;
}

export const mean = (values: number[]) => values.reduce((sum, v) => sum + v, 0) / values.length;
const highest = (values: number[]) => values.reduce((max, v) => (v > max ? v : max), -Infinity);

/** 40 CFR 122.2, "maximum daily discharge limitation": the highest daily discharge. */
export const dailyMaximum = (days: DayFigure[]): Figure | null => figureOf(days, highest);

/**
 * 40 CFR 122.2, "average monthly discharge limitation": the sum of the daily discharges
 * measured during a calendar month divided by their number — not the mean of raw samples.
 */
export function monthlyAverages(days: DayFigure[]): Array<{ month: string; value: Figure; days: number }> {
  const byMonth = new Map<string, DayFigure[]>();
  for (const day of days) {
    const month = day.day.slice(0, 7);
    const list = byMonth.get(month);
    if (list) list.push(day);
    else byMonth.set(month, [day]);
  }
  return [...byMonth.entries()].map(([month, list]) => ({ month, value: figureOf(list, mean)!, days: list.length }));
}

/** "Exceed" is strictly greater than the limit; a "<ML" figure exceeds nothing. */
export const exceeds = (figure: Figure | null, limit: number) => typeof figure === 'number' && figure > limit;
export const fallsBelow = (figure: Figure | null, limit: number) => typeof figure === 'number' && figure < limit;

/**
 * The day whose daily discharge took a monthly average over its limit: walking the month's days
 * in order, the last day on which the average of the days so far went from within the limit to
 * over it (from then on it stayed over). Null when the month's average is within the limit.
 * A site becomes aware of an average's violation with that day's result (40 CFR 403.12(g)(2)).
 */
export function dayThatTookAverageOver(days: DayFigure[], limit: number): string | null {
  let sum = 0;
  let over = false;
  let tipping: string | null = null;
  days.forEach((day, index) => {
    sum += day.value;
    const nowOver = sum / (index + 1) > limit;
    if (nowOver && !over) tipping = day.day;
    over = nowOver;
  });
  return over ? tipping : null;
}
