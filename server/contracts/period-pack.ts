import type { PeriodSummary } from './periods.js';

/** Everything the period pack prints: the summary (signed snapshot or draft) and the records around it. */
export interface PeriodPackInput {
  company: string;
  site: { name: string; address: string; timeZone: string };
  permit: { number: string; kind: 'pretreatment' | 'npdes'; issuingAuthority: string };
  points: Array<{ id: string; code: string; name: string }>;
  summary: PeriodSummary;
  /** The certification of the permit's kind, in full, with its section. */
  statement: { section: string; text: string };
  /** The sample-by-sample table: every result of the period at the permit's points. */
  samples: Array<{
    sampledAt: string;
    pointCode: string;
    parameter: string;
    result: string;
    unit: string;
    mdl: number | null;
    ml: number | null;
    method: string;
    lab: string;
    reportNumber: string;
    findings: string[];
  }>;
  certificates: Array<{
    reportNumber: string;
    lab: string;
    sampledFrom: string;
    sampledTo: string;
    receivedOn: string;
    analysedFrom: string | null;
    analysedTo: string | null;
    fileName: string | null;
    sha256: string | null;
  }>;
  shipments: Array<{
    shippedOn: string;
    documentKind: string;
    documentNumber: string;
    wasteDescription: string;
    quantityLitres: number;
    signedCopyReceivedOn: string | null;
  }>;
  /** Daily flow readings at the permit's points, in their recorded unit. */
  flows: Array<{ day: string; pointCode: string; value: number; unit: string }>;
  /** Follow-ups the period's exceedances and missed monitoring opened, and how each closed. */
  followUps: Array<{ title: string; dueAt: string; status: string; closedAt: string | null; closingNote: string | null }>;
  /** Site time; for a signed period, when it was signed, so its pack is the same file every time. */
  generatedAt: string;
}
