import { z } from 'zod';
import { uuid } from './fields.js';

/** The form fields beside an import's file: a dry run unless `commit` is 'true'. */
export const SpreadsheetImportFields = z.object({ siteId: uuid, commit: z.enum(['true', 'false']).default('false') });
export type SpreadsheetImportFields = z.output<typeof SpreadsheetImportFields>;
