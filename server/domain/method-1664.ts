/**
 * EPA Method 1664, Revision B (EPA-821-R-10-001, February 2010): n-hexane extractable material
 * (HEM; oil and grease) and silica-gel-treated n-hexane extractable material (SGT-HEM;
 * non-polar material). Revision A (EPA-821-R-98-002, 1999) has the same Table 1 criteria.
 */
export type Fraction = 'HEM' | 'SGT-HEM';

/** §1.6: method detection limit and minimum level of quantitation, both fractions, mg/L. */
export const METHOD_DETECTION_LIMIT = 1.4;
export const MINIMUM_LEVEL = 5.0;

/** §8.5 and 40 CFR 136.3 Table II: analyse within 28 days of collection. */
export const HOLDING_TIME_DAYS = 28;

/** §8 and 40 CFR 136.3 Table II: keep at 0–6 °C. */
export const MAX_RECEIPT_TEMPERATURE_C = 6;

interface Window {
  min: number;
  max: number;
}

/** Table 1, acceptance criteria, in percent. */
export const acceptanceCriteria: Record<
  Fraction,
  { opr: Window; matrixSpike: Window; rpdMax: number; iprPrecisionMax: number; iprRecovery: Window }
> = {
  HEM: {
    iprPrecisionMax: 11,
    iprRecovery: { min: 83, max: 101 },
    matrixSpike: { min: 78, max: 114 },
    rpdMax: 18,
    opr: { min: 78, max: 114 },
  },
  'SGT-HEM': {
    iprPrecisionMax: 28,
    iprRecovery: { min: 83, max: 116 },
    matrixSpike: { min: 64, max: 132 },
    rpdMax: 34,
    opr: { min: 64, max: 132 },
  },
};

export const withinWindow = (value: number, window: Window) => value >= window.min && value <= window.max;

/**
 * §9.3: percent recovery P = 100 (A − B) / T, where A is the concentration found in the spiked
 * sample, B the background in the unspiked sample and T the true (spiked) concentration. The
 * spiking solution is half hexadecane (non-polar) and half stearic acid (polar); silica gel
 * removes the polar half, so for SGT-HEM the true value is T / 2.
 */
export function spikeRecovery(fraction: Fraction, found: number, background: number, spiked: number): number {
  const trueValue = fraction === 'SGT-HEM' ? spiked / 2 : spiked;
  return (100 * (found - background)) / trueValue;
}

/** §9.3: relative percent difference between the MS and MSD concentrations. */
export function relativePercentDifference(first: number, second: number): number {
  const mean = (first + second) / 2;
  return mean === 0 ? 0 : (100 * Math.abs(first - second)) / mean;
}

/**
 * Significant figures of a reported decimal string. Trailing zeros of a whole number carry no
 * information ("120" has 2), trailing zeros after a decimal point do ("12.0" has 3).
 */
export function significantFigures(reported: string): number {
  const text = reported.trim().replace(/^[-+]/, '').replace(/e.*$/i, '');
  const digits = text.replace('.', '');
  const withoutLeading = digits.replace(/^0+/, '');
  if (withoutLeading === '') return 1;
  return text.includes('.') ? withoutLeading.length : withoutLeading.replace(/0+$/, '').length || 1;
}

/** §12.3: three significant figures at 10 mg/L and above, two below. */
export function allowedSignificantFigures(valueMgPerL: number): number {
  return Math.abs(valueMgPerL) >= 10 ? 3 : 2;
}

/** The value as the method says to report it (§12.3); the raw value is kept elsewhere. */
export function toMethodPrecision(valueMgPerL: number): string {
  const text = valueMgPerL.toPrecision(allowedSignificantFigures(valueMgPerL));
  // Large values come back in exponent form ("1.23e+3"): write them out ("1230").
  return text.includes('e') ? String(Number(text)) : text;
}
