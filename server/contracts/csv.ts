/**
 * A spreadsheet program could take text starting with = + - @ (or a tab or return) for a
 * formula or a command: such text gets a leading apostrophe, so a record never runs as one.
 */
export function neutralised(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

/** One CSV field: quoted, inner quotes doubled, objects as JSON, and never a formula. */
export const csvField = (value: unknown) =>
  `"${neutralised(value === null || value === undefined ? '' : typeof value === 'string' ? value : String(typeof value === 'object' ? JSON.stringify(value) : value)).replace(/"/g, '""')}"`;
export const csvLine = (values: unknown[]) => values.map(csvField).join(',');
