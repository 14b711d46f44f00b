import type { CreateLabCertificateRequest } from '@contracts/lab.js';

export type Draft = Omit<CreateLabCertificateRequest, 'siteId'>;
export type DraftSample = Draft['samples'][number];
export type DraftResult = DraftSample['results'][number];

export const blankResult = (parameterId = ''): DraftResult => ({
  parameterId, method: '1664B', qualifier: null, value: '', mdl: 1.4, ml: 5.0, unit: 'mg/L', analysedAt: null, qcBatchCode: null,
});

export const blankSample = (dischargePointId = ''): DraftSample => ({
  dischargePointId, collectedAt: '', collectedBy: '', sampleType: 'grab', preservationConfirmed: true,
  temperatureOnReceiptC: null, chainOfCustodyNumber: null, results: [blankResult()],
});

export const blankDraft = (): Draft => ({
  labName: '', labAccreditationNumber: '', reportNumber: '', receivedOn: new Date().toISOString().slice(0, 10), qcBatches: [], samples: [blankSample()],
});

const nullableWhenEmpty = new Set([
  'temperatureOnReceiptC', 'chainOfCustodyNumber', 'analysedAt', 'qcBatchCode', 'mdl', 'ml', 'oprRecoveryPct', 'msRecoveryPct',
  'msdRecoveryPct', 'rpdPct', 'methodBlank', 'spikeTrue', 'spikeBackground', 'msFound', 'msdFound',
]);

/** Empty optional inputs travel as null, so the server does not read them as bad numbers. */
export function toRequest(draft: Draft): Draft {
  return JSON.parse(JSON.stringify(draft, (key, value) => (nullableWhenEmpty.has(key) && value === '' ? null : value)));
}
