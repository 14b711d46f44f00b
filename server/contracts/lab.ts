import { z } from 'zod';
import { type Flag } from './flags.js';
import { decimalText, isoDate, localDateTime, uuid } from './fields.js';
import { sortedPageQuery } from './paging.js';
import { unitNames } from './unit-names.js';

const optionalPercent = z.number().finite().min(0).max(1000).nullable().default(null);
/** Column numeric(12,4): at most 8 digits before the point. */
const optionalAmount = z.number().finite().min(0).max(99_999_999, 'Too large').nullable().default(null);

export const QcBatchInput = z.object({
  code: z.string().trim().min(1, 'Enter the batch code').max(60),
  fraction: z.enum(['HEM', 'SGT-HEM']),
  oprRecoveryPct: optionalPercent,
  msRecoveryPct: optionalPercent,
  msdRecoveryPct: optionalPercent,
  rpdPct: optionalPercent,
  methodBlank: optionalAmount,
  spikeTrue: z.number().finite().positive().max(99_999_999, 'Too large').nullable().default(null),
  spikeBackground: optionalAmount,
  msFound: optionalAmount,
  msdFound: optionalAmount,
});

export const ResultInput = z
  .object({
    parameterId: uuid,
    method: z.string().trim().min(1, 'Name the method').max(40),
    qualifier: z.literal('<').nullable().default(null),
    value: decimalText,
    mdl: z.number().finite().min(0).max(99_999_999, 'Too large').nullable().default(null),
    ml: z.number().finite().min(0).max(99_999_999, 'Too large').nullable().default(null),
    unit: z.enum(unitNames as [string, ...string[]], 'Not a unit Decant knows'),
    analysedAt: localDateTime.nullable().default(null),
    qcBatchCode: z.string().trim().max(60).nullable().default(null),
  })
  .refine((result) => !(result.qualifier === '<' && Number(result.value) <= 0), {
    path: ['value'],
    message: 'With "<" the value is the reporting limit, above zero',
  });

export const SampleInput = z.object({
  dischargePointId: uuid,
  collectedAt: localDateTime,
  collectedBy: z.string().trim().min(1, 'Who collected it?').max(120),
  sampleType: z.enum(['grab', 'composite', 'lab-composite-of-grabs']),
  preservationConfirmed: z.boolean(),
  temperatureOnReceiptC: z.number().finite().min(-30).max(80).nullable().default(null),
  chainOfCustodyNumber: z.string().trim().max(60).nullable().default(null),
  results: z.array(ResultInput).min(1, 'A sample needs at least one result').max(200),
});

export const CertificateFields = z.object({
  siteId: uuid,
  labName: z.string().trim().min(1, 'Enter the lab').max(200),
  labAccreditationNumber: z.string().trim().min(1, 'Enter the accreditation number').max(60),
  reportNumber: z.string().trim().min(1, 'Enter the report number').max(60),
  receivedOn: isoDate,
  receivedTime: z
    .string()
    .regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'Use the form HH:MM (site time)')
    .nullable()
    .default(null),
  qcBatches: z.array(QcBatchInput).max(50).default([]),
  samples: z.array(SampleInput).min(1, 'A certificate needs at least one sample').max(200),
});
export const CreateLabCertificateRequest = CertificateFields;
/** A correction after the first 24 hours says why; the reason is kept in the trail beside before and after. */
export const CorrectionReason = z.string().trim().max(500).nullable().default(null);
export const UpdateLabCertificateRequest = CertificateFields.omit({ siteId: true }).extend({ reason: CorrectionReason });
export type CreateLabCertificateRequest = z.infer<typeof CreateLabCertificateRequest>;
export type UpdateLabCertificateRequest = z.infer<typeof UpdateLabCertificateRequest>;

export const certificateSortKeys = ['receivedOn', 'reportNumber', 'labName'] as const;
export const CertificateListQuery = sortedPageQuery(certificateSortKeys).extend({
  siteId: uuid.optional(),
  flagged: z.enum(['true', 'false']).optional(),
});

export const resultSortKeys = ['collectedLocal', 'parameterName', 'valueShown', 'dischargePointCode', 'reportNumber'] as const;
export const ResultListQuery = sortedPageQuery(resultSortKeys).extend({
  siteId: uuid.optional(),
  dischargePointId: uuid.optional(),
  parameterId: uuid.optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
  flag: z.string().max(40).optional(),
});

export interface StoredFileView {
  id: string;
  fileName: string;
  mediaType: string;
  sizeBytes: number;
  sha256: string;
}

export interface ResultView {
  id: string;
  parameterId: string;
  parameterName: string;
  method: string;
  qualifier: '<' | null;
  valueReported: string;
  /** As the method says to report it (Method 1664 §12.3), or as reported for other methods. */
  valueShown: string;
  mdl: number | null;
  ml: number | null;
  unit: string;
  analysedAt: string | null;
  analysedLocal: string | null;
  qcBatchCode: string | null;
  flags: Flag[];
}

export interface SampleView {
  id: string;
  dischargePointId: string;
  dischargePointCode: string;
  collectedAt: string;
  collectedLocal: string;
  collectedBy: string;
  sampleType: 'grab' | 'composite' | 'lab-composite-of-grabs';
  preservationConfirmed: boolean;
  temperatureOnReceiptC: number | null;
  chainOfCustodyNumber: string | null;
  flags: Flag[];
  results: ResultView[];
}

export interface QcBatchView extends z.infer<typeof QcBatchInput> {
  id: string;
  flags: Flag[];
}

export interface CertificateSummary {
  id: string;
  siteId: string;
  siteName: string;
  labName: string;
  reportNumber: string;
  receivedOn: string;
  sampleCount: number;
  resultCount: number;
  file: StoredFileView | null;
  flags: Flag[];
}

export interface CertificateDetail extends CertificateSummary {
  labAccreditationNumber: string;
  /** The site's local time of day it was received (HH:MM), when entered. */
  receivedTime: string | null;
  /** When it was entered: corrections after the first 24 hours need a reason. */
  enteredAt: string;
  timeZone: string;
  qcBatches: QcBatchView[];
  samples: SampleView[];
}

export interface ResultRow extends ResultView {
  certificateId: string;
  reportNumber: string;
  siteId: string;
  dischargePointCode: string;
  collectedLocal: string;
}

export type CertificateListQuery = z.output<typeof CertificateListQuery>;
export type ResultListQuery = z.output<typeof ResultListQuery>;

export const CertificateFileQuery = z.object({ download: z.enum(['0', '1']).optional() });
export type CertificateFileQuery = z.output<typeof CertificateFileQuery>;
