import { DateTime } from 'luxon';
import type { Flag } from '../contracts/flags.js';
import { convert, isMassRate } from './units.js';
import {
  HOLDING_TIME_DAYS,
  MAX_RECEIPT_TEMPERATURE_C,
  MINIMUM_LEVEL,
  acceptanceCriteria,
  allowedSignificantFigures,
  relativePercentDifference,
  significantFigures,
  spikeRecovery,
  toMethodPrecision,
  withinWindow,
  type Fraction,
} from './method-1664.js';

/** The plain facts the checks need; callers map their records onto these. */
export interface SampleFacts {
  collectedAt: Date;
  sampleType: 'grab' | 'composite' | 'lab-composite-of-grabs';
  preservationConfirmed: boolean;
  temperatureOnReceiptC: number | null;
}

export interface ResultFacts {
  parameterName: string;
  /** HEM or SGT-HEM for oil and grease by Method 1664; null for other parameters. */
  fraction: Fraction | null;
  method: string;
  qualifier: '<' | null;
  /** As reported, to keep its significant figures. */
  valueReported: string;
  unit: string;
  minimumLevel: number | null;
  analysedAt: Date | null;
}

export interface LimitFacts {
  statistic: 'daily-maximum' | 'monthly-average' | 'instantaneous-minimum' | 'instantaneous-maximum';
  value: number;
  unit: string;
  sampleType: 'grab' | 'composite';
}

export interface QcFacts {
  fraction: Fraction;
  oprRecoveryPct: number | null;
  msRecoveryPct: number | null;
  msdRecoveryPct: number | null;
  rpdPct: number | null;
  methodBlank: number | null;
  /** Raw spike data (§9.3), used when the percentages are not given. */
  spike: { spiked: number; background: number; msFound: number; msdFound: number } | null;
}

const source1664 = 'EPA Method 1664 Rev. B (EPA-821-R-10-001)';
const isMethod1664 = (method: string) => /^1664/.test(method.trim());

export function checkSample(sample: SampleFacts, now: Date): Flag[] {
  const flags: Flag[] = [];
  if (sample.collectedAt.getTime() > now.getTime()) {
    flags.push({ code: 'collected-in-future', severity: 'error', message: 'Collected in the future', source: 'data check' });
  }
  if (!sample.preservationConfirmed) {
    flags.push({
      code: 'preservation-not-confirmed',
      severity: 'warning',
      message: 'Preservation to pH < 2 is not confirmed',
      source: `${source1664} §8; 40 CFR 136.3 Table II`,
    });
  }
  if (sample.temperatureOnReceiptC !== null && sample.temperatureOnReceiptC > MAX_RECEIPT_TEMPERATURE_C) {
    flags.push({
      code: 'warm-on-receipt',
      severity: 'warning',
      message: `Received at ${sample.temperatureOnReceiptC} °C, above ${MAX_RECEIPT_TEMPERATURE_C} °C`,
      source: `${source1664} §8; 40 CFR 136.3 Table II`,
    });
  }
  return flags;
}

/**
 * Analysis must start within 28 days of the collection date and time (§8.5). Counted in the
 * site's calendar, so a daylight-saving change does not move the deadline by an hour.
 */
export function holdingTimeExceeded(collectedAt: Date, analysedAt: Date, timeZone: string): boolean {
  const deadline = DateTime.fromJSDate(collectedAt, { zone: timeZone }).plus({ days: HOLDING_TIME_DAYS });
  return analysedAt.getTime() > deadline.toMillis();
}

/**
 * Flags that are findings about how a result was obtained (sample handling, holding time,
 * laboratory QC), as opposed to judgements against a limit: a period summary counts such
 * results as reported, and signing lists them for acknowledgement.
 */
export const labFindingCodes = [
  'collected-in-future',
  'preservation-not-confirmed',
  'warm-on-receipt',
  'analysed-before-collected',
  'holding-time',
  'no-analysis-time',
  'field-composite',
  'qc-opr',
  'qc-ms-recovery',
  'qc-msd-recovery',
  'qc-rpd',
  'qc-method-blank',
];

export function checkResult(result: ResultFacts, sample: SampleFacts, limits: LimitFacts[], timeZone: string): Flag[] {
  const flags: Flag[] = [];
  const value = Number(result.valueReported);
  const oilAndGrease = result.fraction !== null;

  if (result.analysedAt && result.analysedAt.getTime() < sample.collectedAt.getTime()) {
    flags.push({ code: 'analysed-before-collected', severity: 'error', message: 'Analysed before it was collected', source: 'data check' });
  }
  if (oilAndGrease && result.analysedAt && holdingTimeExceeded(sample.collectedAt, result.analysedAt, timeZone)) {
    flags.push({
      code: 'holding-time',
      severity: 'error',
      message: `Analysed more than ${HOLDING_TIME_DAYS} days after collection`,
      source: `${source1664} §8.5; 40 CFR 136.3 Table II`,
    });
  }
  if (oilAndGrease && !result.analysedAt) {
    flags.push({
      code: 'no-analysis-time',
      severity: 'warning',
      message: `No analysis time: the ${HOLDING_TIME_DAYS}-day holding time cannot be checked`,
      source: `${source1664} §8.5; 40 CFR 136.3 Table II`,
    });
  }
  if (oilAndGrease && sample.sampleType === 'composite') {
    flags.push({
      code: 'field-composite',
      severity: 'error',
      message: 'Field composite: oil and grease needs grab samples (grabs may be composited in the laboratory)',
      source: `${source1664} §8.3; 40 CFR 403.12(g)(3)`,
    });
  } else if (sample.sampleType === 'composite' && limits.some((limit) => limit.sampleType === 'grab')) {
    flags.push({ code: 'field-composite', severity: 'error', message: 'The permit requires grab samples here', source: 'the permit' });
  }

  if (oilAndGrease && isMethod1664(result.method) && result.qualifier === null && convertible(value, result.unit)) {
    const mgPerL = convert(value, result.unit, 'mg/L')!;
    const minimumLevel = result.minimumLevel ?? MINIMUM_LEVEL;
    if (mgPerL < minimumLevel) {
      flags.push({
        code: 'below-ml-as-number',
        severity: 'warning',
        message: `Below the ML: report as "<${minimumLevel.toFixed(1)} mg/L", not as a number`,
        source: `${source1664} §12.3.1`,
      });
    }
    if (significantFigures(result.valueReported) > allowedSignificantFigures(mgPerL)) {
      flags.push({
        code: 'excess-precision',
        severity: 'info',
        message: `Reported to more significant figures than the method allows; shown as ${toMethodPrecision(mgPerL)} mg/L`,
        source: `${source1664} §12.3`,
      });
    }
  }

  if (limits.length === 0) {
    flags.push({ code: 'no-limit', severity: 'info', message: `No limit for ${result.parameterName} at this point`, source: 'the permit' });
  }
  for (const limit of limits) {
    // A loading (lb/day) needs the day's flow: the period summary judges it, not a single result.
    if (isMassRate(limit.unit)) continue;
    const comparable = convert(value, result.unit, limit.unit);
    if (comparable === null) {
      flags.push({
        code: 'unit-not-convertible',
        severity: 'error',
        message: `${result.unit} cannot be compared with the limit's ${limit.unit}`,
        source: 'data check',
      });
      continue;
    }
    // A non-detect ("<" reporting limit) never exceeds a maximum; "exceed" is strictly greater.
    if (
      result.qualifier === null &&
      (limit.statistic === 'daily-maximum' || limit.statistic === 'instantaneous-maximum') &&
      comparable > limit.value
    ) {
      flags.push({
        code: 'over-limit',
        severity: 'error',
        message:
          limit.statistic === 'daily-maximum'
            ? `This grab, ${comparable} ${limit.unit}, is over the daily maximum of ${limit.value} ${limit.unit}; the period judges the day's discharge (the average of the day's grabs), which may be within it`
            : `${comparable} ${limit.unit} is over the instantaneous maximum of ${limit.value} ${limit.unit}`,
        source: 'the permit; 40 CFR 122.2 and 403.3(l) for the statistic',
      });
    }
    if (result.qualifier === null && limit.statistic === 'instantaneous-minimum' && comparable < limit.value) {
      flags.push({
        code: 'below-limit',
        severity: 'error',
        message: `${comparable} ${limit.unit} is below the instantaneous minimum of ${limit.value} ${limit.unit}`,
        source: 'the permit',
      });
    }
  }
  return flags;
}

function convertible(value: number, unit: string): boolean {
  return Number.isFinite(value) && convert(value, unit, 'mg/L') !== null;
}

/** QC of a batch against Table 1; recovery and RPD computed from raw spike data when needed (§9.3). */
export function checkQcBatch(qc: QcFacts): Flag[] {
  const criteria = acceptanceCriteria[qc.fraction];
  const table = `${source1664} Table 1 (${qc.fraction})`;
  const flags: Flag[] = [];
  const ms = qc.msRecoveryPct ?? (qc.spike ? spikeRecovery(qc.fraction, qc.spike.msFound, qc.spike.background, qc.spike.spiked) : null);
  const msd = qc.msdRecoveryPct ?? (qc.spike ? spikeRecovery(qc.fraction, qc.spike.msdFound, qc.spike.background, qc.spike.spiked) : null);
  const rpd = qc.rpdPct ?? (qc.spike ? relativePercentDifference(qc.spike.msFound, qc.spike.msdFound) : null);
  const window = (value: number, w: { min: number; max: number }) => `${round(value)} % outside ${w.min}–${w.max} %`;

  if (qc.oprRecoveryPct !== null && !withinWindow(qc.oprRecoveryPct, criteria.opr)) {
    flags.push({ code: 'qc-opr', severity: 'error', message: `OPR recovery ${window(qc.oprRecoveryPct, criteria.opr)}`, source: table });
  }
  if (ms !== null && !withinWindow(ms, criteria.matrixSpike)) {
    flags.push({ code: 'qc-ms-recovery', severity: 'warning', message: `MS recovery ${window(ms, criteria.matrixSpike)}`, source: table });
  }
  if (msd !== null && !withinWindow(msd, criteria.matrixSpike)) {
    flags.push({
      code: 'qc-msd-recovery',
      severity: 'warning',
      message: `MSD recovery ${window(msd, criteria.matrixSpike)}`,
      source: table,
    });
  }
  if (rpd !== null && rpd > criteria.rpdMax) {
    flags.push({ code: 'qc-rpd', severity: 'warning', message: `MS/MSD RPD ${round(rpd)} % above ${criteria.rpdMax} %`, source: table });
  }
  // §9.4 (from memory, to be checked against the text): a blank at or above the ML means the
  // batch's results are suspect.
  if (qc.methodBlank !== null && qc.methodBlank >= MINIMUM_LEVEL) {
    flags.push({
      code: 'qc-method-blank',
      severity: 'warning',
      message: `Method blank ${qc.methodBlank} mg/L at or above the ML`,
      source: `${source1664} §9.4`,
    });
  }
  return flags;
}

const round = (value: number) => Math.round(value * 10) / 10;
