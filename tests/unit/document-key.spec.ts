import { describe, expect, it } from 'vitest';
import { documentKey } from '../../server/domain/document-key.js';

// Unicode Standard Annex #15 (Normalization Forms): NFKC folds compatibility characters such as
// full-width letters and digits to their ordinary forms. Treating case, surrounding blanks and
// invisible characters as no difference in a document number is common practice, no published source.
describe('documentKey: the compared form of a report or document number', () => {
  it('folds full-width forms (UAX #15, NFKC) and case', () => {
    expect(documentKey('ＢＡＳ－１２３')).toBe(documentKey('bas-123'));
  });

  it('ignores surrounding blanks, zero-width and direction characters, and runs of spaces', () => {
    expect(documentKey('  BAS\u200B-123\u202E ')).toBe('bas-123');
    expect(documentKey('Lab   North')).toBe('lab north');
  });

  it('keeps numbers that differ apart', () => {
    expect(documentKey('BAS-123')).not.toBe(documentKey('BAS-124'));
  });
});
