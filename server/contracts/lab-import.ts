import { z } from 'zod';
import { uuid } from './fields.js';

/** The columns of a lab-results spreadsheet, one row per result, in template order. */
export const importColumns = [
  { key: 'lab_name', hint: 'as on the certificate' },
  { key: 'lab_accreditation_number', hint: '' },
  { key: 'report_number', hint: 'unique per lab' },
  { key: 'received_on', hint: 'YYYY-MM-DD' },
  { key: 'discharge_point_code', hint: "the site's code" },
  { key: 'collected_at', hint: 'YYYY-MM-DD HH:mm, site local time' },
  { key: 'collected_by', hint: '' },
  { key: 'sample_type', hint: 'grab, composite or lab-composite-of-grabs' },
  { key: 'preservation_confirmed', hint: 'yes or no' },
  { key: 'temperature_on_receipt', hint: '°C' },
  { key: 'chain_of_custody_number', hint: '' },
  { key: 'parameter_code', hint: 'e.g. oil-grease-hem' },
  { key: 'method', hint: 'e.g. 1664B' },
  { key: 'qualifier', hint: '< for a non-detect, else empty' },
  { key: 'value', hint: 'as reported; with < the reporting limit' },
  { key: 'unit', hint: 'e.g. mg/L' },
  { key: 'mdl', hint: 'same unit' },
  { key: 'ml', hint: 'same unit' },
  { key: 'analysed_at', hint: 'YYYY-MM-DD HH:mm, site local time' },
] as const;

export type ImportColumn = (typeof importColumns)[number]['key'];

export interface ImportRowError {
  row: number;
  column: ImportColumn | null;
  message: string;
}

export interface ImportReport {
  committed: boolean;
  rows: number;
  certificates: number;
  samples: number;
  results: number;
  errors: ImportRowError[];
  /** After a commit: the imported certificates whose results raised findings, to open one by one. */
  withFindings?: Array<{ id: string; reportNumber: string }>;
}

export const ImportTemplateQuery = z.object({ siteId: uuid, format: z.enum(['xlsx', 'csv']).default('xlsx') });
export type ImportTemplateQuery = z.output<typeof ImportTemplateQuery>;
