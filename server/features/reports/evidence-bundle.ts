import { createHash } from 'node:crypto';
import { once } from 'node:events';
import archiver from 'archiver';
import type { Response } from 'express';
import type { DataSource } from 'typeorm';
import { csvLine } from '../../contracts/csv.js';
import type { PeriodSummary } from '../../contracts/periods.js';
import { StoredFile } from '../../kernel/files/stored-file.entity.js';
import type { PeriodRecord } from '../periods/period-input.repository.js';
import { findingSourceIds } from '../periods/finding-ids.js';

const safeName = (name: string) => name.replace(/[^A-Za-z0-9._-]+/g, '-').slice(0, 120);

/** The stored files the bundle carries, by folder: certificates, shipment scans, follow-up evidence. */
async function evidenceFiles(db: DataSource, period: PeriodRecord, summary: PeriodSummary) {
  // Raw SQL: one read of every file id with the folder and name it takes in the bundle.
  const rows: Array<{ id: string; folder: string; label: string }> = await db.query(
    `SELECT DISTINCT c.file_id AS id, 'certificates' AS folder, c.report_number AS label
       FROM lab_certificate c JOIN lab_sample s ON s.certificate_id = c.id
      WHERE c.file_id IS NOT NULL AND s.collected_on BETWEEN $2 AND $3
        AND s.discharge_point_id IN (SELECT discharge_point_id FROM permit_limit WHERE permit_id = $4)
     UNION ALL
     SELECT sf.file_id, 'shipments', sh.document_number FROM shipment sh JOIN shipment_file sf ON sf.shipment_id = sh.id
      WHERE sh.site_id = $1 AND sh.shipped_on BETWEEN $2 AND $3
     UNION ALL
     SELECT f.closing_file_id, 'follow-ups', f.kind FROM follow_up f
      WHERE f.site_id = $1 AND f.closing_file_id IS NOT NULL AND f.source_id = ANY($5::uuid[])
     ORDER BY 2, 3`,
    [period.siteId, period.startsOn, period.endsOn, period.permitId, findingSourceIds(summary)],
  );
  return rows;
}

/** The site's trail from the period's first day to when the pack was made, as CSV. */
async function trailCsv(db: DataSource, period: PeriodRecord, until: Date): Promise<Buffer> {
  const entries: Array<Record<string, unknown>> = await db.query(
    `SELECT e.chain_seq, to_char(e.occurred_at AT TIME ZONE s.time_zone, 'YYYY-MM-DD HH24:MI:SS') AS occurred_at, e.actor_email, e.action,
            e.entity, e.entity_id, e.amendment_id, e.before, e.after, e.hash
       FROM trail_entry e JOIN site s ON s.id = e.site_id
      WHERE e.site_id = $1 AND e.occurred_at >= ($2::date::timestamp AT TIME ZONE s.time_zone) AND e.occurred_at <= $3
      ORDER BY e.chain_seq`,
    [period.siteId, period.startsOn, until],
  );
  const header = [
    'chain_seq',
    'occurred_at_site_time',
    'actor',
    'action',
    'record_kind',
    'record_id',
    'amendment_id',
    'before',
    'after',
    'hash',
  ];
  const lines = entries.map((e) =>
    csvLine([e.chain_seq, e.occurred_at, e.actor_email, e.action, e.entity, e.entity_id, e.amendment_id, e.before, e.after, e.hash]),
  );
  return Buffer.from(`${[csvLine(header), ...lines].join('\r\n')}\r\n`, 'utf8');
}

/**
 * Streams the period's evidence as one ZIP: the pack (PDF and XLSX), every lab certificate PDF,
 * the shipment scans, the follow-up evidence, the trail as CSV, and a manifest with each file's
 * SHA-256. Files are read and added one at a time, so memory does not grow with their number.
 */
export async function streamEvidenceBundle(
  db: DataSource,
  res: Response,
  bundle: { period: PeriodRecord; summary: PeriodSummary; fileName: string; pdf: Buffer; xlsx: Buffer },
): Promise<void> {
  const { period, summary } = bundle;
  const madeAt = new Date(summary.status === 'signed' && summary.signature ? summary.signature.signedAt : summary.compiledAt);
  res.setHeader('Content-Type', 'application/zip');
  res.setHeader('Content-Disposition', `attachment; filename="${bundle.fileName}"`);
  const archive = archiver('zip', { zlib: { level: 6 } });
  archive.pipe(res);
  const manifest: string[][] = [];
  const add = async (name: string, bytes: Buffer) => {
    manifest.push([name, createHash('sha256').update(bytes).digest('hex'), String(bytes.length)]);
    const added = once(archive, 'entry');
    archive.append(bytes, { name, date: madeAt });
    await added;
  };
  await add(`period-pack.pdf`, bundle.pdf);
  await add(`period-pack.xlsx`, bundle.xlsx);
  for (const file of await evidenceFiles(db, period, summary)) {
    const stored = await db
      .getRepository(StoredFile)
      .findOne({ where: { id: file.id }, select: { id: true, fileName: true, content: true } });
    if (stored) await add(`${file.folder}/${safeName(file.label)}-${safeName(stored.fileName)}`, stored.content);
  }
  await add('trail.csv', await trailCsv(db, period, summary.status === 'signed' ? madeAt : new Date()));
  const manifestText = [csvLine(['file', 'sha256', 'bytes']), ...manifest.map((row) => csvLine(row))].join('\r\n');
  archive.append(Buffer.from(`${manifestText}\r\n`, 'utf8'), { name: 'manifest.csv', date: madeAt });
  await archive.finalize();
}
