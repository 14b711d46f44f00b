import { DateTime } from 'luxon';
import type { DataSource, EntityManager } from 'typeorm';
import type { CertificateDetail, CertificateSummary, ResultRow, ResultView, StoredFileView } from '../../contracts/lab.js';
import type { Page } from '../../contracts/paging.js';
import { toMethodPrecision } from '../../domain/method-1664.js';
import { queryPage } from '../../db/page.js';

type Db = DataSource | EntityManager;
const num = (value: string | null) => (value === null ? null : Number(value));
const local = (instant: Date | null, zone: string) =>
  instant ? DateTime.fromJSDate(instant, { zone }).toFormat("yyyy-MM-dd'T'HH:mm") : null;

/** The value as it should be shown: Method 1664 precision for oil and grease in mg/L, as reported otherwise. */
export function shownValue(row: {
  qualifier: string | null;
  value_reported: string;
  fraction: string | null;
  method: string;
  unit: string;
}): string {
  if (row.qualifier === '<') return `<${row.value_reported}`;
  if (row.fraction && /^1664/.test(row.method) && row.unit === 'mg/L') return toMethodPrecision(Number(row.value_reported));
  return row.value_reported;
}

function resultView(row: Record<string, any>, zone: string): ResultView {
  return {
    id: row.id,
    parameterId: row.parameter_id,
    parameterName: row.parameter_name,
    method: row.method,
    qualifier: row.qualifier,
    valueReported: row.value_reported,
    valueShown: shownValue(row as never),
    mdl: num(row.mdl),
    ml: num(row.ml),
    unit: row.unit,
    analysedAt: row.analysed_at?.toISOString() ?? null,
    analysedLocal: local(row.analysed_at, zone),
    qcBatchCode: row.qc_batch_code ?? null,
    flags: row.flags,
  };
}

const fileView = (row: Record<string, any>): StoredFileView | null =>
  row.file_id
    ? { id: row.file_id, fileName: row.file_name, mediaType: row.media_type, sizeBytes: row.size_bytes, sha256: row.sha256 }
    : null;

const summarySelect = `
  SELECT c.*, s.name AS site_name, s.time_zone, f.file_name, f.media_type, f.size_bytes, f.sha256,
         (SELECT count(*)::int FROM lab_sample ls WHERE ls.certificate_id = c.id) AS sample_count,
         (SELECT count(*)::int FROM lab_result lr JOIN lab_sample ls ON ls.id = lr.sample_id WHERE ls.certificate_id = c.id) AS result_count
    FROM lab_certificate c JOIN site s ON s.id = c.site_id LEFT JOIN stored_file f ON f.id = c.file_id`;

function summaryView(row: Record<string, any>): CertificateSummary {
  return {
    id: row.id,
    siteId: row.site_id,
    siteName: row.site_name,
    labName: row.lab_name,
    reportNumber: row.report_number,
    receivedOn: row.received_on,
    sampleCount: row.sample_count,
    resultCount: row.result_count,
    file: fileView(row),
    flags: row.flags,
  };
}

export async function loadCertificate(db: Db, id: string): Promise<CertificateDetail | null> {
  const [row] = await db.query(`${summarySelect} WHERE c.id = $1`, [id]);
  if (!row) return null;
  const zone: string = row.time_zone;
  const batches = await db.query('SELECT * FROM qc_batch WHERE certificate_id = $1 ORDER BY code', [id]);
  const samples = await db.query(
    `SELECT ls.*, d.code AS point_code FROM lab_sample ls JOIN discharge_point d ON d.id = ls.discharge_point_id
      WHERE ls.certificate_id = $1 ORDER BY ls.collected_at, d.code`,
    [id],
  );
  const results = await db.query(
    `SELECT lr.*, p.name AS parameter_name, p.fraction, q.code AS qc_batch_code FROM lab_result lr
       JOIN lab_sample ls ON ls.id = lr.sample_id JOIN parameter p ON p.id = lr.parameter_id
       LEFT JOIN qc_batch q ON q.id = lr.qc_batch_id
      WHERE ls.certificate_id = $1 ORDER BY p.name`,
    [id],
  );
  return {
    ...summaryView(row),
    labAccreditationNumber: row.lab_accreditation_number,
    timeZone: zone,
    qcBatches: batches.map((b: Record<string, any>) => ({
      id: b.id,
      code: b.code,
      fraction: b.fraction,
      oprRecoveryPct: num(b.opr_recovery_pct),
      msRecoveryPct: num(b.ms_recovery_pct),
      msdRecoveryPct: num(b.msd_recovery_pct),
      rpdPct: num(b.rpd_pct),
      methodBlank: num(b.method_blank),
      spikeTrue: num(b.spike_true),
      spikeBackground: num(b.spike_background),
      msFound: num(b.ms_found),
      msdFound: num(b.msd_found),
      flags: b.flags,
    })),
    samples: samples.map((s: Record<string, any>) => ({
      id: s.id,
      dischargePointId: s.discharge_point_id,
      dischargePointCode: s.point_code,
      collectedAt: s.collected_at.toISOString(),
      collectedLocal: local(s.collected_at, zone)!,
      collectedBy: s.collected_by,
      sampleType: s.sample_type,
      preservationConfirmed: s.preservation_confirmed,
      temperatureOnReceiptC: num(s.temperature_on_receipt_c),
      chainOfCustodyNumber: s.chain_of_custody_number,
      flags: s.flags,
      results: results.filter((r: Record<string, any>) => r.sample_id === s.id).map((r: Record<string, any>) => resultView(r, zone)),
    })),
  };
}

const certificateSorts: Record<string, string> = { receivedOn: 'c.received_on', reportNumber: 'c.report_number', labName: 'c.lab_name' };

export async function pageCertificates(
  db: Db,
  siteIds: string[],
  query: { page: number; pageSize: number; sortBy?: string; sortDesc?: boolean; search?: string; flagged?: 'true' | 'false' },
): Promise<Page<CertificateSummary>> {
  const search = query.search ? `%${query.search.replace(/[\\%_]/g, '\\$&')}%` : null;
  const flagged = query.flagged === undefined ? null : query.flagged === 'true';
  return queryPage(
    db,
    {
      select: summarySelect,
      countFrom: 'FROM lab_certificate c',
      where: `c.site_id = ANY($1::uuid[])
      AND ($2::text IS NULL OR c.report_number ILIKE $2 OR c.lab_name ILIKE $2)
      AND ($3::boolean IS NULL OR (jsonb_array_length(c.flags) > 0) = $3)`,
      order: `${certificateSorts[query.sortBy ?? ''] ?? 'c.received_on'} ${query.sortBy && !query.sortDesc ? 'ASC' : 'DESC'}, c.id`,
      params: [siteIds, search, flagged],
    },
    query,
    summaryView,
  );
}

const resultSorts: Record<string, string> = {
  collectedLocal: 'ls.collected_at',
  parameterName: 'p.name',
  valueShown: 'lr.value',
  dischargePointCode: 'd.code',
  reportNumber: 'c.report_number',
};

export async function pageResults(
  db: Db,
  siteIds: string[],
  query: {
    page: number;
    pageSize: number;
    sortBy?: string;
    sortDesc?: boolean;
    dischargePointId?: string;
    parameterId?: string;
    from?: string;
    to?: string;
    flag?: string;
  },
): Promise<Page<ResultRow>> {
  const from = `FROM lab_result lr JOIN lab_sample ls ON ls.id = lr.sample_id JOIN lab_certificate c ON c.id = ls.certificate_id
    JOIN discharge_point d ON d.id = ls.discharge_point_id JOIN parameter p ON p.id = lr.parameter_id
    JOIN site s ON s.id = c.site_id LEFT JOIN qc_batch q ON q.id = lr.qc_batch_id`;
  return queryPage(
    db,
    {
      select: `SELECT lr.*, p.name AS parameter_name, p.fraction, q.code AS qc_batch_code, c.id AS certificate_id, c.report_number, c.site_id,
            d.code AS point_code, ls.collected_at, s.time_zone ${from}`,
      countFrom: from,
      where: `c.site_id = ANY($1::uuid[]) AND ($2::uuid IS NULL OR ls.discharge_point_id = $2) AND ($3::uuid IS NULL OR lr.parameter_id = $3)
      AND ($4::date IS NULL OR ls.collected_on >= $4) AND ($5::date IS NULL OR ls.collected_on <= $5)
      AND ($6::text IS NULL OR lr.flag_codes @> ARRAY[$6]::text[])`,
      order: `${resultSorts[query.sortBy ?? ''] ?? 'ls.collected_at'} ${query.sortBy && !query.sortDesc ? 'ASC' : 'DESC'}, lr.id`,
      params: [
        siteIds,
        query.dischargePointId ?? null,
        query.parameterId ?? null,
        query.from ?? null,
        query.to ?? null,
        query.flag ?? null,
      ],
    },
    query,
    (row: Record<string, any>) => ({
      ...resultView(row, row.time_zone),
      certificateId: row.certificate_id,
      reportNumber: row.report_number,
      siteId: row.site_id,
      dischargePointCode: row.point_code,
      collectedLocal: local(row.collected_at, row.time_zone)!,
    }),
  );
}

/** What an import's rows are read against: the site's point and parameter codes, and the reports already kept. */
export async function importLookups(db: Db, siteId: string) {
  const points: Array<{ code: string; id: string }> = await db.query('SELECT code, id FROM discharge_point WHERE site_id = $1', [siteId]);
  const parameters: Array<{ code: string; id: string }> = await db.query(
    'SELECT code, id FROM parameter WHERE site_id IS NULL OR site_id = $1 ORDER BY site_id NULLS FIRST',
    [siteId],
  );
  const reports: Array<{ lab_name: string; report_number: string }> = await db.query('SELECT lab_name, report_number FROM lab_certificate');
  return {
    siteId,
    pointIds: new Map(points.map((row) => [row.code, row.id])),
    parameterIds: new Map(parameters.map((row) => [row.code, row.id])),
    existingReports: new Set(reports.map((row) => `${row.lab_name}\u0000${row.report_number}`)),
  };
}

/** The code of a site's first active discharge point, to fill the import template's example row. */
export async function firstActivePointCode(db: Db, siteId: string): Promise<string | undefined> {
  const [point]: Array<{ code: string }> = await db.query(
    'SELECT code FROM discharge_point WHERE site_id = $1 AND active ORDER BY code LIMIT 1',
    [siteId],
  );
  return point?.code;
}
