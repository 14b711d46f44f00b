import { describe, expect, it } from 'vitest';
import { actionWords, fieldChanges, reasonOf, recordKindWords, recordName } from '../../server/contracts/trail-words.js';
import { neutralised } from '../../server/contracts/csv.js';

// The product brief: the trail reads in words, not in the program's own names (invented fixtures).
describe('the trail in words', () => {
  it('names actions and record kinds in words', () => {
    expect(actionWords('attach-file')).toBe('Attached a file');
    expect(actionWords('record-submission')).toBe('Recorded the report as sent');
    expect(recordKindWords('reporting-period')).toBe('Reporting period');
    expect(recordKindWords('lab_result')).toBe('Lab result');
  });
  it('names a record by its own fields', () => {
    expect(recordName(null, { reportNumber: 'R-7', id: 'x' }, 'x')).toBe('R-7');
    expect(recordName({ startsOn: '2026-01-01', endsOn: '2026-06-30' }, null, 'p')).toBe('2026-01-01 – 2026-06-30');
    expect(recordName(null, null, 'id-1')).toBe('id-1');
  });
  it('lists only the fields that changed, with the reason apart', () => {
    expect(fieldChanges({ value: 1, unit: 'mg/L', updatedAt: 'a' }, { value: 2, unit: 'mg/L', updatedAt: 'b', reason: 'typo' })).toEqual([
      { field: 'value', before: '1', after: '2' },
    ]);
    expect(reasonOf({ reason: 'typo' })).toBe('typo');
    expect(reasonOf({})).toBeNull();
  });
  // OWASP's guidance on CSV injection: = + - @ tab and return lead a formula or a command.
  it('neutralises text a spreadsheet would run', () => {
    for (const text of ['=1+1', '+1', '-1', '@SUM(A1)', '\ttab', '\rret']) expect(neutralised(text)).toBe(`'${text}`);
    expect(neutralised('Used oil')).toBe('Used oil');
  });
});
