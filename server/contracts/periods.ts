/** The period summary on the wire: what GET /api/periods/:id/summary answers. Field names are stable. */
export type Figure = number | '<ML';
export type Statistic = 'daily-maximum' | 'monthly-average' | 'instantaneous-minimum' | 'instantaneous-maximum';

export interface Exceedance {
  /** A day (YYYY-MM-DD), or a month (YYYY-MM) for a monthly average. */
  date: string;
  value: number;
  /** `value` at the precision the method or the permit calls for. */
  shownValue: string;
  limit: number;
  percentOver: number;
  resultIds: string[];
  certificateIds: string[];
}

export interface LimitRow {
  limitId: string;
  dischargePointId: string;
  pointCode: string;
  parameterId: string;
  parameter: string;
  statistic: Statistic;
  unit: string;
  limitValue: number;
  /** The statistic over the period ("<ML" when every input was a non-detect); the highest month for a monthly average. */
  computedValue: Figure | null;
  /** `computedValue` at the precision the method or permit calls for (raw value kept above). */
  shownValue: string | null;
  /** The rule `shownValue` follows, with its source. */
  precision: string;
  exceeded: boolean;
  samplesTaken: number;
  samplesRequired: number;
  missedMonitoring: Array<{ unit: string; taken: number; required: number }>;
  /** For a mass limit (lb/day, kg/day): days sampled without a flow reading, so no loading could be worked out. */
  daysWithoutFlow: string[];
  dailyValues: Array<{ day: string; value: Figure; massLoading: { lbPerDay: number; kgPerDay: number } | null }>;
  monthlyValues: Array<{ month: string; value: Figure; shownValue: string; days: number; exceeded: boolean }>;
  exceedances: Exceedance[];
}

export interface SncVerdict {
  parameterId: string;
  parameterName: string;
  window: { start: string; end: string };
  measurements: number;
  exceeding: number;
  chronic: boolean;
  reviewFactor: number | null;
  atOrAboveReviewLevel: number | null;
  technicalReview: boolean | null;
}

export interface PeriodSummaryCore {
  nonDetectPolicy: 'zero' | 'mdl' | 'ml' | 'half-mdl';
  massLoadingFactor: number;
  rows: LimitRow[];
  /** Null for a direct-discharge (NPDES) permit: the verdicts of 40 CFR 403.8 do not apply. */
  significantNoncompliance: SncVerdict[] | null;
}

export interface PeriodSummary extends PeriodSummaryCore {
  periodId: string;
  permitId: string;
  siteId: string;
  period: { start: string; end: string; due: string };
  status: string;
  compiledAt: string;
  oil: { collectedLitres: number; shippedLitres: number };
  openFollowUps: number;
  labFlagCount: number;
  /** When the periodic report was sent against its due date, and whether lateness is significant. */
  reportTimeliness: { dueOn: string; submittedOn: string | null; daysLate: number; lateReportDays: number; significantNoncompliance: boolean | null };
  cautions: string[];
}
