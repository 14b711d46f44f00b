/**
 * The form in which two document or report numbers are compared: Unicode NFKC (UAX #15, so a
 * full-width "ＢＡＳ－１２３" is "BAS-123"), trimmed, invisible and direction characters removed,
 * runs of white space made one space, lower case. Kept as typed; compared by this key. The
 * database's document_key() (migration DocumentKeys) does the same, for its unique indexes.
 */
const invisible = /[\u00AD\u200B-\u200F\u202A-\u202E\u2060-\u2064\u2066-\u2069\uFEFF]/g;

export function documentKey(text: string): string {
  return text.trim().normalize('NFKC').replace(invisible, '').replace(/\s+/g, ' ').trim().toLowerCase();
}
