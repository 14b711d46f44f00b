import { describe, expect, it } from 'vitest';
import { blanksToNull } from '@/composables/form-values';

describe('blanksToNull', () => {
  it('sends a cleared number field as null and keeps a blank note as an empty text', () => {
    const body = blanksToNull({ hoursRun: '' as unknown as number | null, note: '', volume: 2.4 }, ['hoursRun']);
    expect(body).toEqual({ hoursRun: null, note: '', volume: 2.4 });
  });

  it('turns every blank into null when no fields are named', () => {
    expect(blanksToNull({ a: '', b: 'x', c: 0 })).toEqual({ a: null, b: 'x', c: 0 });
  });
});
