import { z } from 'zod';
import { isoDate, uuid } from './fields.js';

/**
 * The period summary on the wire: what GET /api/periods/:id/summary answers. Field names are
 * stable; each is described here, and the descriptions reach /api/openapi.json.
 */
const doc = <T extends z.ZodType>(schema: T, description: string) => schema.meta({ description });

export const Figure = doc(z.union([z.number(), z.literal('<ML')]), 'A number, or "<ML" when every input was a non-detect');
export type Figure = z.infer<typeof Figure>;
export const Statistic = z.enum(['daily-maximum', 'monthly-average', 'instantaneous-minimum', 'instantaneous-maximum']);
export type Statistic = z.infer<typeof Statistic>;

export const Exceedance = z.object({
  date: doc(z.string(), 'A day (YYYY-MM-DD), or a month (YYYY-MM) for a monthly average'),
  value: doc(z.number(), "The figure over the limit (under it for an instantaneous minimum), in the limit's unit, unrounded"),
  shownValue: doc(z.string(), '`value` at the precision the method or the permit calls for'),
  limit: doc(z.number(), 'The limit, in its unit'),
  percentOver: doc(z.number(), 'How far past the limit (above a maximum, below a minimum), in % of the limit, to one decimal'),
  resultIds: doc(z.array(z.string()), 'The lab results (or flow readings) behind the figure'),
  certificateIds: doc(z.array(z.string()), 'The certificates of those results'),
  awareCertificateIds: doc(
    z.array(z.string()).optional(),
    'The certificates that made the site aware: for a monthly average, those of the day that took it over (40 CFR 403.12(g)(2))',
  ),
});
export type Exceedance = z.infer<typeof Exceedance>;

export const LimitRow = z.object({
  limitId: doc(z.string(), 'The limit version the row judges'),
  appliesFrom: doc(z.string(), 'The first day of the period this version judged (a later version judges the days after it)'),
  appliesTo: doc(z.string(), 'The last day of the period this version judged'),
  dischargePointId: z.string(),
  pointCode: z.string(),
  parameterId: z.string(),
  parameter: doc(z.string(), "The parameter's name"),
  statistic: Statistic,
  unit: doc(z.string(), "The limit's unit; every figure of the row is in it (lb/day or kg/day for a mass limit)"),
  limitValue: z.number(),
  computedValue: doc(
    Figure.nullable(),
    'The statistic over the period: the highest daily discharge, the highest monthly average, or the extreme single measurement; null without data',
  ),
  shownValue: doc(
    z.string().nullable(),
    '`computedValue` at the precision the method or permit calls for; the raw value stays in `computedValue`',
  ),
  precision: doc(z.string(), 'The rule `shownValue` follows, with its source'),
  exceeded: doc(z.boolean(), 'Strictly greater than a maximum (or less than a minimum), on any day or month of the period'),
  samplesTaken: doc(z.number(), 'Samples taken in the period'),
  samplesRequired: doc(z.number(), 'Samples the monitoring frequency asks for in the whole calendar units of the period that are over'),
  missedMonitoring: doc(
    z.array(z.object({ unit: z.string(), taken: z.number(), required: z.number() })),
    'Each day, ISO week, month or quarter with fewer samples than required',
  ),
  daysWithoutFlow: doc(z.array(z.string()), 'For a mass limit: sampled days without a flow reading, where no loading could be worked out'),
  dailyValues: doc(
    z.array(z.object({ day: z.string(), value: Figure, massLoading: z.object({ lbPerDay: z.number(), kgPerDay: z.number() }).nullable() })),
    "The daily discharges of 40 CFR 122.2, in the limit's unit, with the mass loading where the day has a flow reading",
  ),
  monthlyValues: doc(
    z.array(z.object({ month: z.string(), value: Figure, shownValue: z.string(), days: z.number(), exceeded: z.boolean() })),
    "For a monthly average: each calendar month's average of its daily discharges (40 CFR 122.2)",
  ),
  exceedances: z.array(Exceedance),
  inputsWithFindings: doc(
    z.array(z.string()),
    'Results counted in the row that carry a lab finding (holding time, temperature, QC, no analysis time); counted as reported',
  ),
  grabsOverOnCompliantDays: doc(
    z.array(z.object({ day: z.string(), grabValue: z.number(), dayValue: z.number() })),
    "For a daily maximum judged on the day's average: days where one grab was over the limit but the day's discharge was within it",
  ),
});
export type LimitRow = z.infer<typeof LimitRow>;

export const SncVerdict = z.object({
  parameterId: z.string(),
  parameterName: z.string(),
  window: doc(z.object({ start: z.string(), end: z.string() }), 'The six-month window (calendar half or rolling, per the permit)'),
  measurements: doc(z.number(), 'Measurements held to a daily or instantaneous limit in the window'),
  exceeding: doc(z.number(), 'Of those, how many exceed a limit'),
  chronic: doc(z.boolean(), '40 CFR 403.8(f)(2)(viii)(A): 66 % or more exceed'),
  reviewFactor: doc(z.number().nullable(), '1.4 for BOD, TSS, fats, oil and grease; 1.2 for other pollutants; null for pH'),
  atOrAboveReviewLevel: doc(z.number().nullable(), 'Measurements equal to or over limit × reviewFactor'),
  technicalReview: doc(z.boolean().nullable(), '40 CFR 403.8(f)(2)(viii)(B): 33 % or more at or over the review level; null for pH'),
});
export type SncVerdict = z.infer<typeof SncVerdict>;

export const PeriodSummaryCore = z.object({
  nonDetectPolicy: doc(z.enum(['zero', 'mdl', 'ml', 'half-mdl']), 'What a non-detect counts as in averages, per the permit'),
  massLoadingFactor: doc(z.number(), 'lb/day = MGD × mg/L × this factor (8.34 or 8.3454)'),
  rows: doc(z.array(LimitRow), 'One row per discharge point × limit of the permit'),
  significantNoncompliance: doc(
    z.array(SncVerdict).nullable(),
    'Verdicts per pollutant and six-month window; null for a direct-discharge (NPDES) permit, where 40 CFR 403.8 does not apply',
  ),
});
export type PeriodSummaryCore = z.infer<typeof PeriodSummaryCore>;

/** Something signing must not be blind to: a lab finding, a missed sample, an open violation follow-up. */
export const SignOffItem = z.object({
  kind: z.enum(['lab-finding', 'missed-sample', 'open-follow-up']),
  id: doc(z.string(), 'The result, monitoring unit or follow-up it is about'),
  text: z.string(),
});
export type SignOffItem = z.infer<typeof SignOffItem>;

export const Signature = z.object({
  revision: z.number(),
  signerName: z.string(),
  signerTitle: z.string(),
  signedAt: z.string(),
  statementSection: z.string(),
  sha256: doc(z.string(), 'SHA-256 of the signed snapshot (summary, inputs, signer, statement, trail head)'),
  trailHead: doc(z.object({ seq: z.string(), hash: z.string() }), "The trail chain's head when the period was signed"),
  amendmentReason: doc(z.string().nullable(), 'For revision 2 and later: why the period was amended'),
  packSha256: doc(z.string().nullable(), 'SHA-256 of the period pack (PDF) stored with the signature'),
  packXlsxSha256: doc(z.string().nullable(), 'SHA-256 of the period pack workbook (XLSX) stored with the signature'),
});
export type Signature = z.infer<typeof Signature>;

export const OpenAmendment = z.object({
  id: z.string(),
  amendsRevision: z.number(),
  reason: z.string(),
  openedByName: z.string(),
  openedAt: z.string(),
});
export type OpenAmendment = z.infer<typeof OpenAmendment>;

export const PeriodSummary = PeriodSummaryCore.extend({
  periodId: z.string(),
  permitId: z.string(),
  siteId: z.string(),
  period: z.object({ start: z.string(), end: z.string(), due: z.string() }),
  status: doc(z.string(), 'open, compiled (a draft), signed (the figures are the signed snapshot), amended (an amendment is open)'),
  revision: doc(z.number(), 'Signed revisions so far: 0 until the first signature'),
  signature: doc(Signature.nullable(), 'The signed revision this summary is, or (while amended) the last one signed'),
  amendment: doc(OpenAmendment.nullable(), 'The open amendment, while the period is amended'),
  compiledAt: z.string(),
  oil: doc(
    z.object({ collectedLitres: z.number(), shippedLitres: z.number(), onHandAtEndLitres: z.number().nullable() }),
    'Oil collected and shipped in the period, and on hand at its end (null before the opening balance)',
  ),
  openFollowUps: z.number(),
  labFlagCount: doc(z.number(), 'Results of the period the lab checks flagged'),
  reportTimeliness: doc(
    z.object({
      dueOn: z.string(),
      submittedOn: z.string().nullable(),
      daysLate: z.number(),
      lateReportDays: z.number(),
      significantNoncompliance: z.boolean().nullable(),
    }),
    'When the periodic report was sent against its due date, and whether lateness is significant (pretreatment permits)',
  ),
  cautions: doc(z.array(z.string()), 'The summary is a record-keeping aid; the permit and the control authority decide'),
});
export type PeriodSummary = z.infer<typeof PeriodSummary>;

export const PeriodListQuery = z.object({ siteId: uuid.optional(), permitId: uuid.optional() });
export type PeriodListQuery = z.output<typeof PeriodListQuery>;

/** When the periodic report went to the control authority. */
export const SubmissionRequest = z.object({ submittedOn: isoDate });
export type SubmissionRequest = z.output<typeof SubmissionRequest>;

/** What signing asks: the statement of the permit's kind, and what must be acknowledged. */
export const SignOffChecklist = z.object({
  canSign: z.boolean(),
  reasonNotSignable: z.string().nullable(),
  statementSection: z.string(),
  statement: z.string(),
  items: z.array(SignOffItem),
  compiledAt: z.string().nullable(),
  recentSignInRequired: doc(z.boolean(), 'True when the signer must sign in again (last authentication over 15 minutes ago)'),
});
export type SignOffChecklist = z.infer<typeof SignOffChecklist>;

export const SignRequest = z.object({
  compiledAt: doc(z.iso.datetime({ offset: true }), 'The compile the signer reviewed: signing refuses if the records changed since'),
  statementAccepted: z.literal(true, 'Accept the certification statement to sign'),
  acknowledged: doc(z.boolean(), 'Every listed finding, missed sample and open follow-up was reviewed'),
  acknowledgementNote: z.string().trim().max(2000).nullable().default(null),
  signerName: z.string().trim().min(1, 'Enter the name of the person signing').max(200),
  signerTitle: z.string().trim().min(1, 'Enter the title of the person signing').max(200),
});
export type SignRequest = z.output<typeof SignRequest>;

export const AmendRequest = z.object({ reason: z.string().trim().min(1, 'Say why the period is amended').max(2000) });
export type AmendRequest = z.output<typeof AmendRequest>;

/** What changed between a revision and the one before it. */
export const RevisionChanges = z.object({
  values: z.array(z.object({ row: z.string(), before: z.string().nullable(), after: z.string().nullable() })),
  verdicts: z.array(z.object({ row: z.string(), before: z.string(), after: z.string() })),
  exceedancesAdded: z.array(z.object({ row: z.string(), date: z.string(), value: z.string() })),
  exceedancesRemoved: z.array(z.object({ row: z.string(), date: z.string(), value: z.string() })),
});
export type RevisionChanges = z.infer<typeof RevisionChanges>;

export const Revision = Signature.extend({
  changes: doc(RevisionChanges.nullable(), 'What changed from the revision before; null for revision 1'),
});
export type Revision = z.infer<typeof Revision>;

export const RevisionParams = z.object({ id: uuid, revision: z.coerce.number().int().min(1).max(1000) });
export type RevisionParams = z.output<typeof RevisionParams>;

/** The content hashes of what a signed period was compiled from. */
export const SignatureInputs = z.object({
  results: z.array(z.tuple([z.string(), z.string()])),
  certificates: z.array(z.tuple([z.string(), z.string()])),
  flows: z.array(z.tuple([z.string(), z.string()])),
  limitVersions: z.array(z.tuple([z.string(), z.string()])),
  permitSettings: z.string(),
});
export type SignatureInputs = z.infer<typeof SignatureInputs>;

export const periodStatuses = ['open', 'compiled', 'signed', 'amended'] as const;
export type PeriodStatus = (typeof periodStatuses)[number];

/** A reporting period as the periods list shows it: what it is, not how its permit computes. */
export interface PeriodListItem {
  id: string;
  permitId: string;
  permitNumber: string;
  permitKind: 'pretreatment' | 'npdes';
  siteId: string;
  timeZone: string;
  startsOn: string;
  endsOn: string;
  dueOn: string;
  status: PeriodStatus;
  lateReportDays: number;
  submittedOn: string | null;
  /** The site's today when the list was read. */
  today: string;
  compiledAt: string | null;
  revision: number;
  /** The last signature: by whom, when, and the SHA-256 of the pack kept with it. */
  lastSignature: { signerName: string; signedAt: string; packSha256: string | null } | null;
}
