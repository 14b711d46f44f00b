import { z } from 'zod';
import { CreateLabCertificateRequest } from '../../contracts/lab.js';
import { importColumns, type ImportColumn, type ImportRowError } from '../../contracts/lab-import.js';
import { decimalText, isoDate } from '../../contracts/fields.js';
import { unitNames } from '../../contracts/unit-names.js';
import type { ImportRow } from '../../kernel/spreadsheets/spreadsheet-rows.js';
import { reportKey } from './lab.repository.js';

/** The template's example row carries this report number, so it can never be imported as a real certificate. */
export const EXAMPLE_REPORT_PREFIX = 'EXAMPLE-DELETE-THIS-ROW';

const blankToNull = (value: string | undefined) => (value === undefined || value.trim() === '' ? null : value.trim());
const localTime = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}[ T]\d{2}:\d{2}$/, 'Use YYYY-MM-DD HH:mm')
  .transform((text) => text.replace(' ', 'T'));
const optionalNumber = z.preprocess(blankToNull, z.coerce.number().finite().nullable());

const RowSchema = z.object({
  lab_name: z.string().min(1, 'Required').max(200),
  lab_accreditation_number: z.string().min(1, 'Required').max(60),
  report_number: z.string().min(1, 'Required').max(60),
  received_on: isoDate,
  discharge_point_code: z.string().min(1, 'Required'),
  collected_at: localTime,
  collected_by: z.string().min(1, 'Required').max(120),
  sample_type: z.enum(['grab', 'composite', 'lab-composite-of-grabs'], 'grab, composite or lab-composite-of-grabs'),
  preservation_confirmed: z.enum(['yes', 'no'], 'yes or no').transform((value) => value === 'yes'),
  temperature_on_receipt: optionalNumber,
  chain_of_custody_number: z.preprocess(blankToNull, z.string().max(60).nullable()),
  parameter_code: z.string().min(1, 'Required'),
  method: z.string().min(1, 'Required').max(40),
  qualifier: z.preprocess(blankToNull, z.literal('<', 'Either < or empty').nullable()),
  value: decimalText,
  unit: z.enum(unitNames as [string, ...string[]], 'Not a unit Decant knows'),
  mdl: optionalNumber,
  ml: optionalNumber,
  analysed_at: z.preprocess(blankToNull, localTime.nullable()),
});

export interface ImportLookups {
  siteId: string;
  pointIds: Map<string, string>;
  parameterIds: Map<string, string>;
  existingReports: Set<string>;
}

export interface ImportPlan {
  requests: CreateLabCertificateRequest[];
  errors: ImportRowError[];
  rows: number;
}

const certificateFields: ImportColumn[] = ['lab_accreditation_number', 'received_on'];
const sampleFields: ImportColumn[] = [
  'collected_by',
  'sample_type',
  'preservation_confirmed',
  'temperature_on_receipt',
  'chain_of_custody_number',
];

/**
 * Checks every row and groups them: one certificate per lab and report number, one sample per
 * point and collection time. Every problem is reported with its row and column; nothing here
 * writes.
 */
export async function planImport(rows: AsyncIterable<ImportRow>, lookups: ImportLookups, maxErrors = 500): Promise<ImportPlan> {
  const errors: ImportRowError[] = [];
  const certificates = new Map<
    string,
    {
      request: CreateLabCertificateRequest;
      firstRow: Record<string, unknown>;
      firstRowNumber: number;
      samples: Map<string, { index: number; first: Record<string, unknown> }>;
      /** The spreadsheet row of each result, by sample and result index. */
      resultRows: number[][];
    }
  >();
  let count = 0;
  const fail = (row: number, column: ImportColumn | null, message: string) => {
    if (errors.length < maxErrors) errors.push({ row, column, message });
  };

  for await (const { row, cells } of rows) {
    count += 1;
    const parsed = RowSchema.safeParse(cells);
    // The codes are checked whatever else is wrong with the row, so one dry run names every problem.
    const pointCode = String(cells.discharge_point_code ?? '').trim();
    const parameterCode = String(cells.parameter_code ?? '').trim();
    const pointId = lookups.pointIds.get(pointCode);
    const parameterId = lookups.parameterIds.get(parameterCode);
    if (pointCode && !pointId) fail(row, 'discharge_point_code', `No discharge point “${pointCode}” at the site (see the Codes sheet)`);
    if (parameterCode && !parameterId) fail(row, 'parameter_code', `No parameter “${parameterCode}” (see the Codes sheet)`);
    if (String(cells.report_number ?? '').startsWith(EXAMPLE_REPORT_PREFIX)) {
      fail(row, 'report_number', "This is the template's example row: delete it before importing");
    }
    if (!parsed.success) {
      for (const issue of parsed.error.issues) fail(row, (issue.path[0] as ImportColumn) ?? null, issue.message);
      continue;
    }
    const data = parsed.data;
    if (data.report_number.startsWith(EXAMPLE_REPORT_PREFIX)) continue;
    if (lookups.existingReports.has(reportKey(data.lab_name, data.report_number))) {
      fail(row, 'report_number', 'This lab already has a certificate with this report number');
    }
    if (data.qualifier === '<' && Number(data.value) <= 0) fail(row, 'value', 'With "<" the value is the reporting limit, above zero');
    if (!pointId || !parameterId) continue;

    const certificateKey = reportKey(data.lab_name, data.report_number);
    let certificate = certificates.get(certificateKey);
    if (!certificate) {
      certificate = {
        request: {
          siteId: lookups.siteId,
          labName: data.lab_name,
          labAccreditationNumber: data.lab_accreditation_number,
          reportNumber: data.report_number,
          receivedOn: data.received_on,
          // Files carry no time of receipt: the site became aware when the import was entered.
          receivedTime: null,
          qcBatches: [],
          samples: [],
        },
        firstRow: data,
        firstRowNumber: row,
        samples: new Map(),
        resultRows: [],
      };
      certificates.set(certificateKey, certificate);
    }
    for (const field of certificateFields) {
      if (certificate.firstRow[field] !== data[field as keyof typeof data])
        fail(row, field, 'Differs from an earlier row of the same certificate');
    }
    const sampleKey = `${pointId}\u0000${data.collected_at}`;
    let sample = certificate.samples.get(sampleKey);
    if (!sample) {
      sample = { index: certificate.request.samples.length, first: data };
      certificate.samples.set(sampleKey, sample);
      certificate.request.samples.push({
        dischargePointId: pointId,
        collectedAt: data.collected_at,
        collectedBy: data.collected_by,
        sampleType: data.sample_type,
        preservationConfirmed: data.preservation_confirmed,
        temperatureOnReceiptC: data.temperature_on_receipt,
        chainOfCustodyNumber: data.chain_of_custody_number,
        results: [],
      });
    }
    for (const field of sampleFields) {
      if (sample.first[field] !== data[field as keyof typeof data]) fail(row, field, 'Differs from an earlier row of the same sample');
    }
    (certificate.resultRows[sample.index] ??= []).push(row);
    certificate.request.samples[sample.index]!.results.push({
      parameterId,
      method: data.method,
      qualifier: data.qualifier,
      value: data.value,
      mdl: data.mdl,
      ml: data.ml,
      unit: data.unit,
      analysedAt: data.analysed_at,
      qcBatchCode: null,
    });
  }
  if (count === 0) errors.push({ row: 1, column: null, message: 'The file has no rows below its header' });
  // The dry run checks what the commit will check: each certificate as the JSON route takes it.
  for (const certificate of certificates.values()) {
    const checked = CreateLabCertificateRequest.safeParse(certificate.request);
    if (checked.success) continue;
    for (const issue of checked.error.issues) {
      const [first, sampleIndex, second, resultIndex, field] = issue.path;
      const row =
        first === 'samples' && typeof sampleIndex === 'number'
          ? ((second === 'results' && typeof resultIndex === 'number'
              ? certificate.resultRows[sampleIndex]?.[resultIndex]
              : certificate.resultRows[sampleIndex]?.[0]) ?? certificate.firstRowNumber)
          : certificate.firstRowNumber;
      const key = String(field ?? second ?? first ?? '');
      fail(row, importColumnOf(key), issue.message);
    }
  }
  errors.sort((a, b) => a.row - b.row);
  return { requests: [...certificates.values()].map((certificate) => certificate.request), errors, rows: count };
}

/** The template column of a request field ("analysedAt" → "analysed_at"), when there is one. */
function importColumnOf(field: string): ImportColumn | null {
  const snake = field.replace(/[A-Z]/g, (letter) => `_${letter.toLowerCase()}`);
  const renamed: Record<string, string> = { temperature_on_receipt_c: 'temperature_on_receipt' };
  const column = renamed[snake] ?? snake;
  return (importColumns as ReadonlyArray<{ key: string }>).some((known) => known.key === column) ? (column as ImportColumn) : null;
}
