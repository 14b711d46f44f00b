import type { DataSource, EntityManager } from 'typeorm';
import { periodPackPdf } from '../../../reports/period-pack-pdf.js';
import { periodPackXlsx } from '../../../reports/period-pack-xlsx.js';
import type { PeriodSummary } from '../../contracts/periods.js';
import type { Download } from '../../http/download.js';
import type { PeriodRecord } from '../periods/period-input.repository.js';
import { loadPackInput } from './period-pack.repository.js';

/** The period pack's file name: permit, period and revision (or draft). */
export function packFileName(period: PeriodRecord, summary: PeriodSummary, extension: string): string {
  const state = summary.status === 'signed' && summary.signature ? `rev${summary.signature.revision}` : 'draft';
  return `decant-${period.permitNumber}-${period.startsOn}-${period.endsOn}-${state}.${extension}`.replace(/[^A-Za-z0-9._-]+/g, '-');
}

/** The moment a pack is generated at: a signed period's signing time (so a signature always gives the same file), else its compile. */
const generatedAt = (summary: PeriodSummary) =>
  summary.status === 'signed' && summary.signature ? new Date(summary.signature.signedAt) : new Date(summary.compiledAt);

/** Both files of the pack from one read of the period's records, as signing keeps them. */
export async function buildPeriodPack(
  db: DataSource | EntityManager,
  period: PeriodRecord,
  summary: PeriodSummary,
): Promise<{ pdf: Buffer; xlsx: Buffer }> {
  const input = await loadPackInput(db, period, summary, generatedAt(summary));
  return { pdf: await periodPackPdf(input), xlsx: Buffer.from(await periodPackXlsx(input)) };
}

/** The pack's PDF for what the period page shows: a signed period's snapshot or a marked draft. */
export async function periodPackDownload(db: DataSource, period: PeriodRecord, summary: PeriodSummary): Promise<Download> {
  return {
    bytes: await periodPackPdf(await loadPackInput(db, period, summary, generatedAt(summary))),
    mediaType: 'application/pdf',
    fileName: packFileName(period, summary, 'pdf'),
  };
}

export const XLSX_MEDIA_TYPE = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

/** The pack as a workbook, built on request from what the period page shows. */
export async function periodPackXlsxDownload(db: DataSource, period: PeriodRecord, summary: PeriodSummary): Promise<Download> {
  return {
    bytes: await periodPackXlsx(await loadPackInput(db, period, summary, generatedAt(summary))),
    mediaType: XLSX_MEDIA_TYPE,
    fileName: packFileName(period, summary, 'xlsx'),
  };
}
