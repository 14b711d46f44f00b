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
});
export type Exceedance = z.infer<typeof Exceedance>;

export const LimitRow = z.object({
  limitId: z.string(),
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

export const PeriodSummary = PeriodSummaryCore.extend({
  periodId: z.string(),
  permitId: z.string(),
  siteId: z.string(),
  period: z.object({ start: z.string(), end: z.string(), due: z.string() }),
  status: doc(z.string(), 'open, compiled; signed and amended come with reporting'),
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
}
