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

/**
 * Builds the pack's PDF for what the period page shows: a signed period's snapshot (generated
 * at its signing time, so the same signature always gives the same file) or a marked draft.
 */
export async function buildPeriodPackPdf(db: DataSource | EntityManager, period: PeriodRecord, summary: PeriodSummary): Promise<Buffer> {
  const signedAt = summary.status === 'signed' && summary.signature ? new Date(summary.signature.signedAt) : new Date(summary.compiledAt);
  return periodPackPdf(await loadPackInput(db, period, summary, signedAt));
}

export async function periodPackDownload(db: DataSource, period: PeriodRecord, summary: PeriodSummary): Promise<Download> {
  return {
    bytes: await buildPeriodPackPdf(db, period, summary),
    mediaType: 'application/pdf',
    fileName: packFileName(period, summary, 'pdf'),
  };
}

/** The pack as a workbook, built on request from what the period page shows. */
export async function periodPackXlsxDownload(db: DataSource, period: PeriodRecord, summary: PeriodSummary): Promise<Download> {
  const at = summary.status === 'signed' && summary.signature ? new Date(summary.signature.signedAt) : new Date(summary.compiledAt);
  return {
    bytes: await periodPackXlsx(await loadPackInput(db, period, summary, at)),
    mediaType: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
    fileName: packFileName(period, summary, 'xlsx'),
  };
}
