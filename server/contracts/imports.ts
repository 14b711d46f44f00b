import { z } from 'zod';
import { uuid } from './fields.js';

/**
 * The form fields beside an import's file: a dry run unless `commit` is 'true'. `runId`, chosen
 * by the client, names the run so its progress can be asked for while the upload is open.
 */
export const SpreadsheetImportFields = z.object({
  siteId: uuid,
  commit: z.enum(['true', 'false']).default('false'),
  runId: uuid.optional(),
});
export type SpreadsheetImportFields = z.output<typeof SpreadsheetImportFields>;

export const importRunStatuses = ['reading', 'checking', 'writing', 'done', 'failed'] as const;
export type ImportRunStatus = (typeof importRunStatuses)[number];

/** How an import is doing: what it is at, how many rows of how many, and since when. */
export const ImportRunView = z.object({
  id: z.string(),
  kind: z.string(),
  fileName: z.string(),
  status: z.enum(importRunStatuses),
  rowsTotal: z.number(),
  rowsDone: z.number(),
  message: z.string().nullable(),
  startedAt: z.string(),
  finishedAt: z.string().nullable(),
  timeLimitSeconds: z.number(),
});
export type ImportRunView = z.infer<typeof ImportRunView>;
