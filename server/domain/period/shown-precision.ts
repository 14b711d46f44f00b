import { allowedSignificantFigures } from '../method-1664.js';
import { convert, units } from '../units.js';
import type { Figure } from './types.js';

export interface PrecisionRule {
  significantFigures?: (value: number) => number;
  decimals?: number;
  source: string;
}

const METHOD_1664_SOURCE = 'EPA Method 1664 Rev. B §12.3: three significant figures at 10 mg/L and above, two below';
// From memory: Standard Methods 4500-H+ B reports pH to the nearest 0.1 unit.
const ph: PrecisionRule = { decimals: 1, source: 'pH to 0.1 unit (Standard Methods 4500-H+ B)' };
const threeFigures: PrecisionRule = {
  significantFigures: () => 3,
  source: 'Three significant figures (common practice, no published source); the permit may call for another precision',
};

/** The precision a limit's figures are shown to: the permit's, else the method's, else the trade's habit. */
export function precisionRule(limit: { unit: string; method1664: boolean; reportedDecimals: number | null }): PrecisionRule {
  if (limit.reportedDecimals !== null) {
    return {
      decimals: limit.reportedDecimals,
      source: `The permit: ${limit.reportedDecimals} decimal place${limit.reportedDecimals === 1 ? '' : 's'}`,
    };
  }
  const dimension = units[limit.unit]?.dimension;
  if (limit.method1664 && dimension === 'concentration') {
    // §12.3 is stated in mg/L; the threshold is read in mg/L whatever the limit's unit.
    return {
      source: METHOD_1664_SOURCE,
      significantFigures: (value) => allowedSignificantFigures(convert(value, limit.unit, 'mg/L') ?? value),
    };
  }
  if (dimension === 'ph') return ph;
  return threeFigures;
}

/** A figure as text at the rule's precision; the raw number stays in the summary beside it. */
export function shownFigure(value: Figure | null, rule: PrecisionRule): string | null {
  if (value === null || value === '<ML') return value;
  if (rule.decimals !== undefined) return value.toFixed(rule.decimals);
  if (value === 0) return '0';
  const text = value.toPrecision(rule.significantFigures!(value));
  // Large values come back in exponent form ("1.23e+3"): write them out ("1230").
  return text.includes('e') ? String(Number(text)) : text;
}
