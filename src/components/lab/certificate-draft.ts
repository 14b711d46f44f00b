import type { CertificateDetail, CreateLabCertificateRequest } from '@contracts/lab.js';

export type Draft = Omit<CreateLabCertificateRequest, 'siteId'>;
export type DraftSample = Draft['samples'][number];
export type DraftResult = DraftSample['results'][number];

export const blankResult = (parameterId = ''): DraftResult => ({
  parameterId,
  method: '1664B',
  qualifier: null,
  value: '',
  mdl: 1.4,
  ml: 5.0,
  unit: 'mg/L',
  analysedAt: null,
  qcBatchCode: null,
});

export const blankSample = (dischargePointId = ''): DraftSample => ({
  dischargePointId,
  collectedAt: '',
  collectedBy: '',
  sampleType: 'grab',
  preservationConfirmed: true,
  temperatureOnReceiptC: null,
  chainOfCustodyNumber: null,
  results: [blankResult()],
});

/** An empty certificate; `today` is the site's local date, the usual day a lab's report arrives. */
export const blankDraft = (today: string): Draft => ({
  labName: '',
  labAccreditationNumber: '',
  reportNumber: '',
  receivedOn: today,
  receivedTime: null,
  qcBatches: [],
  samples: [blankSample()],
});

const nullableWhenEmpty = new Set([
  'temperatureOnReceiptC',
  'chainOfCustodyNumber',
  'analysedAt',
  'qcBatchCode',
  'mdl',
  'ml',
  'oprRecoveryPct',
  'msRecoveryPct',
  'msdRecoveryPct',
  'rpdPct',
  'methodBlank',
  'spikeTrue',
  'spikeBackground',
  'msFound',
  'msdFound',
]);

/** Empty optional inputs travel as null, so the server does not read them as bad numbers. */
export function toRequest(draft: Draft): Draft {
  return JSON.parse(JSON.stringify(draft, (key, value) => (nullableWhenEmpty.has(key) && value === '' ? null : value)));
}

/** A saved certificate as a draft to correct: what was entered, in the site's local time. */
export function fromDetail(detail: CertificateDetail): Draft {
  return {
    labName: detail.labName,
    labAccreditationNumber: detail.labAccreditationNumber,
    reportNumber: detail.reportNumber,
    receivedOn: detail.receivedOn,
    receivedTime: detail.receivedTime,
    qcBatches: detail.qcBatches.map(({ id: _id, flags: _flags, ...batch }) => batch),
    samples: detail.samples.map((sample) => ({
      dischargePointId: sample.dischargePointId,
      collectedAt: sample.collectedLocal,
      collectedBy: sample.collectedBy,
      sampleType: sample.sampleType,
      preservationConfirmed: sample.preservationConfirmed,
      temperatureOnReceiptC: sample.temperatureOnReceiptC,
      chainOfCustodyNumber: sample.chainOfCustodyNumber,
      results: sample.results.map((result) => ({
        parameterId: result.parameterId,
        method: result.method,
        qualifier: result.qualifier,
        value: result.valueReported,
        mdl: result.mdl,
        ml: result.ml,
        unit: result.unit,
        analysedAt: result.analysedLocal,
        qcBatchCode: result.qcBatchCode,
      })),
    })),
  };
}
