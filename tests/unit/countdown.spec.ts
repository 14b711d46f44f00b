import { describe, expect, it } from 'vitest';
import { countdown } from '../../server/contracts/follow-ups.js';

// One set of words for the time left to a deadline, on every screen (Decant's own wording).
describe('the countdown to a deadline', () => {
  const now = new Date('2026-12-03T12:00:00Z');
  const at = (hours: number) => new Date(now.getTime() + hours * 3_600_000);
  it.each([
    [1, 'in 1 hour', false, true],
    [20, 'in 20 hours', false, true],
    [47, 'in 47 hours', false, true],
    [48, 'in 2 days', false, false],
    [24 * 21, 'in 21 days', false, false],
    [-3, '3 hours overdue', true, true],
    [-24 * 21, '21 days overdue', true, true],
  ])('%s hours from now reads "%s"', (hours, text, overdue, soon) => {
    expect(countdown(at(hours), now)).toEqual({ text, overdue, soon });
  });
});
