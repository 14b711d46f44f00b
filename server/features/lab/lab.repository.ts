import { documentKey } from '../../domain/document-key.js';
import { DateTime } from 'luxon';
import type { DataSource, DeepPartial, EntityManager, QueryDeepPartialEntity } from 'typeorm';
import { Site } from '../../kernel/sites/site.entity.js';
import { type Parameter } from '../parameters/parameter.entity.js';
import { LabCertificate } from './lab-certificate.entity.js';
import { LabResult } from './lab-result.entity.js';
import { LabSample } from './lab-sample.entity.js';
import { QcBatch } from './qc-batch.entity.js';
import type {
  CertificateDetail,
  CertificateSummary,
  certificateSortKeys,
  ResultRow,
  resultSortKeys,
  ResultView,
  StoredFileView,
} from '../../contracts/lab.js';
import type { Page } from '../../contracts/paging.js';
import { MINIMUM_LEVEL, toMethodPrecision } from '../../domain/method-1664.js';
import { queryPage } from '../../db/page.js';

type Db = DataSource | EntityManager;
const num = (value: string | null) => (value === null ? null : Number(value));
const local = (instant: Date | null, zone: string) =>
  instant ? DateTime.fromJSDate(instant, { zone }).toFormat("yyyy-MM-dd'T'HH:mm") : null;

/** The value as it should be shown: Method 1664 precision for oil and grease in mg/L, as reported otherwise. */
/**
 * A result as it is reported. Method 1664 §12.3.1: a result below the minimum level of
 * quantitation is reported as "<ML" ("<5.0 mg/L", or the lab's own ML), however the lab wrote
 * it; the period summary counts it the same way.
 */
export function shownValue(row: {
  qualifier: string | null;
  value_reported: string;
  fraction: string | null;
  method: string;
  unit: string;
  ml?: string | number | null;
}): string {
  if (row.qualifier === '<') return `<${row.value_reported}`;
  if (row.fraction && /^1664/.test(row.method) && row.unit === 'mg/L') {
    const ml = row.ml === null || row.ml === undefined ? MINIMUM_LEVEL : Number(row.ml);
    const value = Number(row.value_reported);
    return value < ml ? `<${ml.toFixed(1)}` : toMethodPrecision(value);
  }
  return row.value_reported;
}

function resultView(result: LabResult & { parameter: Parameter; qcBatch?: QcBatch | null }, zone: string): ResultView {
  return {
    id: result.id,
    parameterId: result.parameterId,
    parameterName: result.parameter.name,
    method: result.method,
    qualifier: result.qualifier,
    valueReported: result.valueReported,
    valueShown: shownValue({
      qualifier: result.qualifier,
      value_reported: result.valueReported,
      fraction: result.parameter.fraction,
      method: result.method,
      unit: result.unit,
      ml: result.ml,
    }),
    mdl: result.mdl,
    ml: result.ml,
    unit: result.unit,
    analysedAt: result.analysedAt?.toISOString() ?? null,
    analysedLocal: local(result.analysedAt, zone),
    qcBatchCode: result.qcBatch?.code ?? null,
    flags: result.flags,
  };
}

interface FileColumns {
  file_id: string | null;
  file_name: string | null;
  media_type: string | null;
  size_bytes: number | null;
  sha256: string | null;
}

const fileView = (row: FileColumns): StoredFileView | null =>
  row.file_id
    ? { id: row.file_id, fileName: row.file_name!, mediaType: row.media_type!, sizeBytes: row.size_bytes!, sha256: row.sha256! }
    : null;

interface CertificateSummaryRow extends FileColumns {
  id: string;
  site_id: string;
  site_name: string;
  lab_name: string;
  report_number: string;
  received_on: string;
  sample_count: number;
  result_count: number;
  flags: CertificateSummary['flags'];
}

// Raw SQL: the list's page and count come with each certificate's sample and result counts in one read.
const summarySelect = `
  SELECT c.*, s.name AS site_name, f.file_name, f.media_type, f.size_bytes, f.sha256,
         (SELECT count(*)::int FROM lab_sample ls WHERE ls.certificate_id = c.id) AS sample_count,
         (SELECT count(*)::int FROM lab_result lr JOIN lab_sample ls ON ls.id = lr.sample_id WHERE ls.certificate_id = c.id) AS result_count
    FROM lab_certificate c JOIN site s ON s.id = c.site_id LEFT JOIN stored_file f ON f.id = c.file_id`;

function summaryView(row: CertificateSummaryRow): CertificateSummary {
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

/** A certificate whole: its file (without the bytes), QC batches, samples and their results. */
export async function loadCertificate(db: Db, id: string): Promise<CertificateDetail | null> {
  const certificate = await db
    .getRepository(LabCertificate)
    .createQueryBuilder('certificate')
    .innerJoinAndSelect('certificate.site', 'site')
    .leftJoin('certificate.file', 'file')
    .addSelect(['file.id', 'file.fileName', 'file.mediaType', 'file.sizeBytes', 'file.sha256'])
    .where('certificate.id = :id', { id })
    .getOne();
  if (!certificate) return null;
  const zone = certificate.site!.timeZone;
  const batches = await db.getRepository(QcBatch).find({ where: { certificateId: id }, order: { code: 'ASC' } });
  const samples = await db.getRepository(LabSample).find({
    where: { certificateId: id },
    relations: { dischargePoint: true },
    order: { collectedAt: 'ASC', dischargePoint: { code: 'ASC' } },
  });
  const results = await db
    .getRepository(LabResult)
    .createQueryBuilder('result')
    .innerJoin('result.sample', 'sample')
    .innerJoinAndSelect('result.parameter', 'parameter')
    .leftJoinAndSelect('result.qcBatch', 'qcBatch')
    .where('sample.certificateId = :id', { id })
    .orderBy('parameter.name')
    .getMany();
  const file = certificate.file;
  return {
    id: certificate.id,
    siteId: certificate.siteId,
    siteName: certificate.site!.name,
    labName: certificate.labName,
    reportNumber: certificate.reportNumber,
    receivedOn: certificate.receivedOn,
    sampleCount: samples.length,
    resultCount: results.length,
    file: file ? { id: file.id, fileName: file.fileName, mediaType: file.mediaType, sizeBytes: file.sizeBytes, sha256: file.sha256 } : null,
    flags: certificate.flags,
    labAccreditationNumber: certificate.labAccreditationNumber,
    receivedTime: certificate.receivedTime?.slice(0, 5) ?? null,
    enteredAt: certificate.createdAt.toISOString(),
    timeZone: zone,
    qcBatches: batches.map(({ certificateId: _certificateId, certificate: _certificate, ...batch }) => batch),
    samples: samples.map((sample) => ({
      id: sample.id,
      dischargePointId: sample.dischargePointId,
      dischargePointCode: sample.dischargePoint!.code,
      collectedAt: sample.collectedAt.toISOString(),
      collectedLocal: local(sample.collectedAt, zone)!,
      collectedBy: sample.collectedBy,
      sampleType: sample.sampleType,
      preservationConfirmed: sample.preservationConfirmed,
      temperatureOnReceiptC: sample.temperatureOnReceiptC,
      chainOfCustodyNumber: sample.chainOfCustodyNumber,
      flags: sample.flags,
      results: results
        .filter((result) => result.sampleId === sample.id)
        .map((result) => resultView(result as LabResult & { parameter: Parameter }, zone)),
    })),
  };
}

const certificateSorts: Record<(typeof certificateSortKeys)[number], string> = {
  receivedOn: 'c.received_on',
  reportNumber: 'c.report_number',
  labName: 'c.lab_name',
};

export async function pageCertificates(
  db: Db,
  siteIds: string[],
  query: {
    page: number;
    pageSize: number;
    sortBy?: (typeof certificateSortKeys)[number];
    sortDesc?: boolean;
    search?: string;
    flagged?: 'true' | 'false';
  },
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
      order: `${query.sortBy ? certificateSorts[query.sortBy] : 'c.received_on'} ${query.sortBy && !query.sortDesc ? 'ASC' : 'DESC'}, c.id`,
      params: [siteIds, search, flagged],
    },
    query,
    summaryView,
  );
}

const resultSorts: Record<(typeof resultSortKeys)[number], string> = {
  collectedLocal: 'ls.collected_at',
  parameterName: 'p.name',
  valueShown: 'lr.value',
  dischargePointCode: 'd.code',
  reportNumber: 'c.report_number',
};

interface ResultPageRow {
  id: string;
  parameter_id: string;
  parameter_name: string;
  fraction: 'HEM' | 'SGT-HEM' | null;
  method: string;
  qualifier: '<' | null;
  value_reported: string;
  mdl: string | null;
  ml: string | null;
  unit: string;
  analysed_at: Date | null;
  qc_batch_code: string | null;
  flags: ResultView['flags'];
  certificate_id: string;
  report_number: string;
  site_id: string;
  point_code: string;
  collected_at: Date;
  time_zone: string;
}

// Raw SQL: a page of results across five tables and its count over one filter, read at once.
export async function pageResults(
  db: Db,
  siteIds: string[],
  query: {
    page: number;
    pageSize: number;
    sortBy?: (typeof resultSortKeys)[number];
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
      order: `${query.sortBy ? resultSorts[query.sortBy] : 'ls.collected_at'} ${query.sortBy && !query.sortDesc ? 'ASC' : 'DESC'}, lr.id`,
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
    (row: ResultPageRow) => ({
      id: row.id,
      parameterId: row.parameter_id,
      parameterName: row.parameter_name,
      method: row.method,
      qualifier: row.qualifier,
      valueReported: row.value_reported,
      valueShown: shownValue(row),
      mdl: num(row.mdl),
      ml: num(row.ml),
      unit: row.unit,
      analysedAt: row.analysed_at?.toISOString() ?? null,
      analysedLocal: local(row.analysed_at, row.time_zone),
      qcBatchCode: row.qc_batch_code,
      flags: row.flags,
      certificateId: row.certificate_id,
      reportNumber: row.report_number,
      siteId: row.site_id,
      dischargePointCode: row.point_code,
      collectedLocal: local(row.collected_at, row.time_zone)!,
    }),
  );
}

/** How an import recognises a report: lab and number in their compared form. */
export const reportKey = (labName: string, reportNumber: string) => `${documentKey(labName)}\u0000${documentKey(reportNumber)}`;

/** What an import's rows are read against: the site's point and parameter codes, and the reports already kept. */
export async function importLookups(db: Db, siteId: string) {
  const points: Array<{ code: string; id: string }> = await db.query('SELECT code, id FROM discharge_point WHERE site_id = $1', [siteId]);
  const parameters: Array<{ code: string; id: string }> = await db.query(
    'SELECT code, id FROM parameter WHERE site_id IS NULL OR site_id = $1 ORDER BY site_id NULLS FIRST',
    [siteId],
  );
  const reports: Array<{ lab_name: string; report_number: string }> = await db.query(
    'SELECT lab_name, report_number FROM lab_certificate WHERE site_id = $1',
    [siteId],
  );
  return {
    siteId,
    pointIds: new Map(points.map((row) => [row.code, row.id])),
    parameterIds: new Map(parameters.map((row) => [row.code, row.id])),
    existingReports: new Set(reports.map((row) => reportKey(row.lab_name, row.report_number))),
  };
}

/** The code of a site's first active discharge point, to fill the import template's example row. */
/** Of these certificates, those with a result that raised a finding (a warning or an error; notes do not count). */
export async function certificatesWithFindings(db: Db, ids: string[]): Promise<Array<{ id: string; reportNumber: string }>> {
  if (ids.length === 0) return [];
  // Raw SQL: an existence test over the certificates' results in one read.
  const rows: Array<{ id: string; report_number: string }> = await db.query(
    `SELECT c.id, c.report_number FROM lab_certificate c
      WHERE c.id = ANY($1::uuid[]) AND EXISTS (SELECT 1 FROM lab_sample s JOIN lab_result r ON r.sample_id = s.id
                                               WHERE s.certificate_id = c.id
                                                 AND jsonb_path_exists(r.flags, '$[*] ? (@.severity != "info")'))
      ORDER BY c.report_number`,
    [ids],
  );
  return rows.map((row) => ({ id: row.id, reportNumber: row.report_number }));
}

/** The codes an import names: the site's active discharge points and the parameters it can use. */
export async function templateCodes(db: Db, siteId: string) {
  const points: Array<{ code: string; name: string }> = await db.query(
    'SELECT code, name FROM discharge_point WHERE site_id = $1 AND active ORDER BY code',
    [siteId],
  );
  const parameters: Array<{ code: string; name: string; default_unit: string }> = await db.query(
    'SELECT code, name, default_unit FROM parameter WHERE site_id IS NULL OR site_id = $1 ORDER BY code',
    [siteId],
  );
  return { points, parameters: parameters.map((p) => ({ code: p.code, name: p.name, defaultUnit: p.default_unit })) };
}

/** The site a certificate is written for, with the zone its local times are read in. */
export async function findSiteZone(db: Db, siteId: string): Promise<{ id: string; timeZone: string } | null> {
  return db.getRepository(Site).findOne({ where: { id: siteId }, select: { id: true, timeZone: true } });
}

/** Whether the site already keeps this lab's report number, compared by document_key(). */
export function reportNumberTaken(
  db: Db,
  report: { siteId: string; labName: string; reportNumber: string },
  exceptId?: string,
): Promise<boolean> {
  const query = db
    .getRepository(LabCertificate)
    .createQueryBuilder('c')
    .where('c.siteId = :siteId', { siteId: report.siteId })
    .andWhere('document_key(c.labName) = document_key(:labName)', { labName: report.labName })
    .andWhere('document_key(c.reportNumber) = document_key(:reportNumber)', { reportNumber: report.reportNumber });
  if (exceptId) query.andWhere('c.id <> :exceptId', { exceptId });
  return query.getExists();
}

export async function insertCertificateRecord(manager: EntityManager, certificate: DeepPartial<LabCertificate>): Promise<string> {
  return (await manager.save(LabCertificate, manager.create(LabCertificate, certificate))).id;
}

export async function updateCertificateRecord(
  manager: EntityManager,
  id: string,
  changes: QueryDeepPartialEntity<LabCertificate>,
): Promise<void> {
  await manager.update(LabCertificate, { id }, changes);
}
