/** Plain data in and out of the period compiler; no database, no clock. */
export type NonDetectPolicy = 'zero' | 'mdl' | 'ml' | 'half-mdl';
export type { Statistic } from '../../contracts/periods.js';
import type { Statistic } from '../../contracts/periods.js';

export interface PermitSettings {
  kind: 'pretreatment' | 'npdes';
  nonDetectPolicy: NonDetectPolicy;
  massLoadingFactor: number;
  dailyMaxAppliesToEachGrab: boolean;
  sncWindow: 'calendar-halves' | 'rolling';
  /**
   * What a monitoring frequency counts: sampling days (two grabs on one day are one sampling
   * event; common practice, no published source) or every sample. A permit setting.
   */
  monitoringCounts: 'sampling-days' | 'samples';
}

export interface LimitInput {
  id: string;
  dischargePointId: string;
  pointCode: string;
  parameterId: string;
  parameterName: string;
  /** 40 CFR 403.8(f)(2)(viii)(B) factor; null for pH (and flow). */
  sncReviewFactor: number | null;
  /** Flow is monitored but is not a pollutant: no significant-noncompliance verdict. */
  isPollutant: boolean;
  /** Measured by EPA Method 1664 (HEM or SGT-HEM), whose §12.3 sets the reported precision. */
  method1664: boolean;
  /** Decimal places the permit asks figures to be reported to, or null. */
  reportedDecimals: number | null;
  statistic: Statistic;
  /** In `unit`: a concentration, pH, temperature, flow, or a loading (lb/day, kg/day) for a mass limit. */
  value: number;
  unit: string;
  frequencyCount: number;
  frequencyPer: 'day' | 'week' | 'month' | 'quarter';
  /** The first day this version of the limit applies. */
  appliesFrom: string;
  /** The last day it applies; null while in force. */
  appliesTo: string | null;
}

export interface Measurement {
  resultId: string;
  certificateId: string;
  dischargePointId: string;
  parameterId: string;
  /** The site's local calendar day of collection (YYYY-MM-DD). */
  day: string;
  qualifier: '<' | null;
  /** In the base unit of what is measured (mg/L, SU, °C, MGD: `measuredUnitFor`); the compiler turns it into each limit's unit. */
  value: number;
  mdl: number | null;
  ml: number | null;
  /** The result carries a lab finding (holding time, temperature, QC, no analysis time…). */
  hasFinding?: boolean;
}

export interface FlowReading {
  dischargePointId: string;
  day: string;
  /** Million gallons per day. */
  mgd: number;
}

export interface PeriodInput {
  permit: PermitSettings;
  /** `asOf`: the site's today; monitoring units not over yet are not counted as missed. */
  period: { start: string; end: string; asOf?: string };
  limits: LimitInput[];
  /** Measurements from the start of the earliest six-month window to the period's end. */
  measurements: Measurement[];
  flows: FlowReading[];
}

/** A value that is a number, or "<ML" when every input was a non-detect. */
export type { Figure } from '../../contracts/periods.js';
