/**
 * The trail in words: what each action and record kind is called on screen and in exports, a
 * record's name from its own fields, and the fields a change touched. Shared by the server
 * (CSV export) and the client (the trail screen).
 */
const actions: Record<string, string> = {
  create: 'Created',
  update: 'Changed',
  delete: 'Deleted',
  import: 'Imported',
  'new-version': 'Made a new version',
  end: 'Ended',
  compile: 'Compiled',
  sign: 'Signed',
  amend: 'Opened an amendment',
  'record-submission': 'Recorded the report as sent',
  'attach-file': 'Attached a file',
  close: 'Closed',
  send: 'Sent',
  revise: 'Saved a new version',
  attach: 'Attached as evidence',
  upload: 'Uploaded',
  'sign-in': 'Signed in',
  'sign-out': 'Signed out',
  'insert-outside-decant': 'Added outside Decant',
  'update-outside-decant': 'Changed outside Decant',
  'delete-outside-decant': 'Deleted outside Decant',
};

const kinds: Record<string, string> = {
  user: 'Person',
  site: 'Site',
  'discharge-point': 'Discharge point',
  parameter: 'Parameter',
  permit: 'Permit',
  'permit-settings': 'Permit settings',
  limit: 'Limit',
  'lab-certificate': 'Lab certificate',
  lab_certificate: 'Lab certificate',
  lab_sample: 'Lab sample',
  lab_result: 'Lab result',
  equipment: 'Equipment',
  'oil-log-entry': 'Oil log entry',
  oil_log_entry: 'Oil log entry',
  'upkeep-check': 'Upkeep check',
  shipment: 'Shipment',
  'flow-reading': 'Flow reading',
  flow_reading: 'Flow reading',
  'reporting-period': 'Reporting period',
  'follow-up': 'Follow-up',
  'authority-notice': 'Notice to the authority',
  'application-sheet': 'Application sheet',
  'tank-check': 'Tank check',
  'upkeep-photo': 'Upkeep photo',
  'oil-opening-balance': 'Oil opening balance',
  preferences: 'Own settings',
  permit_limit: 'Limit',
  permit_settings: 'Permit settings',
};

/** "attach-file" → "Attached a file"; an action without words of its own reads as itself, spaced. */
export const actionWords = (action: string) => actions[action] ?? action.replace(/[-_]/g, ' ');
export const recordKindWords = (entity: string) => kinds[entity] ?? entity.replace(/[-_]/g, ' ');
export const recordKinds = Object.entries(kinds)
  .filter(([key]) => !key.includes('_'))
  .map(([value, title]) => ({ value, title }));

const asRecord = (value: unknown): Record<string, unknown> =>
  value && typeof value === 'object' && !Array.isArray(value) ? (value as Record<string, unknown>) : {};

/** The name a person knows a record by, from the fields it carries (before or after). */
export function recordName(before: unknown, after: unknown, entityId: string): string {
  const fields = { ...asRecord(before), ...asRecord(after) };
  const pick = (...keys: string[]) =>
    keys.map((key) => fields[key]).find((v) => typeof v === 'string' && v.length > 0) as string | undefined;
  if (typeof fields.startsOn === 'string' && typeof fields.endsOn === 'string') return `${fields.startsOn} – ${fields.endsOn}`;
  return (
    pick(
      'reportNumber',
      'report_number',
      'documentNumber',
      'document_number',
      'number',
      'code',
      'title',
      'name',
      'equipment',
      'email',
      'fileName',
    ) ??
    (typeof fields.collectedOn === 'string' ? `collected ${fields.collectedOn}` : undefined) ??
    (typeof fields.day === 'string' ? `day ${fields.day}` : undefined) ??
    entityId
  );
}

/** Fields that say nothing about the change itself. */
const quiet = new Set(['updatedAt', 'updated_at', 'createdAt', 'created_at', 'id', 'reason', 'samples', 'qcBatches', 'flags']);
const shown = (value: unknown): string | null =>
  value === undefined || value === null ? null : typeof value === 'string' ? value : JSON.stringify(value);

/** Each field whose value changed, before → after (a created record: every field after; a deleted one: before). */
export function fieldChanges(before: unknown, after: unknown): Array<{ field: string; before: string | null; after: string | null }> {
  const a = asRecord(before);
  const b = asRecord(after);
  return [...new Set([...Object.keys(a), ...Object.keys(b)])]
    .filter((field) => !quiet.has(field) && shown(a[field]) !== shown(b[field]))
    .map((field) => ({ field, before: shown(a[field]), after: shown(b[field]) }));
}

/** The reason a correction or amendment gave, where there was one. */
export function reasonOf(after: unknown): string | null {
  const reason = asRecord(after).reason;
  return typeof reason === 'string' && reason.length > 0 ? reason : null;
}
