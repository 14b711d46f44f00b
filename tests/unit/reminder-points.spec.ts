import { describe, expect, it } from 'vitest';
import { dueReminder, reminderPoints } from '../../server/features/notices/deadline-sweep.js';

const HOUR = 3600_000;
const DAY = 24 * HOUR;
const opened = new Date('2026-03-02T15:00:00Z');

describe('when follow-up reminders fall', () => {
  it('reminds of a 24-hour notice within the hour of its deadline and when it is overdue (40 CFR 403.12(g)(2): 24 hours)', () => {
    const due = new Date(opened.getTime() + 24 * HOUR);
    // "A day before" a 24-hour deadline is its opening, which its first mail covered.
    expect(reminderPoints(opened, due)).toEqual([
      { key: 'within-the-hour', at: new Date(due.getTime() - HOUR) },
      { key: 'overdue', at: due },
    ]);
  });

  it('reminds of a 30-day repeat sample 7 days and 1 day before, and when overdue (40 CFR 403.12(g)(2): 30 days)', () => {
    const due = new Date(opened.getTime() + 30 * DAY);
    expect(reminderPoints(opened, due).map((p) => [p.key, (due.getTime() - p.at.getTime()) / DAY])).toEqual([
      ['7-days', 7],
      ['1-day', 1],
      ['overdue', 0],
    ]);
  });

  it('sends only the latest reminder reached, so a sweep that ran late sends one mail, not a backlog', () => {
    const due = new Date(opened.getTime() + 30 * DAY);
    expect(dueReminder(opened, due, new Date(opened.getTime() + 10 * DAY))).toBeNull();
    expect(dueReminder(opened, due, new Date(due.getTime() - 3 * DAY))?.key).toBe('7-days');
    expect(dueReminder(opened, due, new Date(due.getTime() + 2 * DAY))?.key).toBe('overdue');
  });
});
