/**
 * Unit conversion for results, limits and flows. Each unit belongs to one dimension and has a
 * factor to that dimension's base unit. 1 US gal = 3.785411784 L and 1 lb = 0.45359237 kg
 * (both exact, NIST Handbook 44, Appendix C).
 */
export const US_GALLON_LITRES = 3.785411784;
/** 1 ft = 0.3048 m (exact, NIST Handbook 44, Appendix C). */
export const FOOT_METRES = 0.3048;
const POUND_KILOGRAMS = 0.45359237;

interface UnitDefinition {
  dimension: 'concentration' | 'flow' | 'ph' | 'temperature' | 'volume' | 'mass-rate';
  /** Multiply by this to reach the base unit (mg/L, L/day, SU, L, kg/day). Temperature is affine, handled apart. */
  toBase: number;
}

export const units: Record<string, UnitDefinition> = {
  'mg/L': { dimension: 'concentration', toBase: 1 },
  'µg/L': { dimension: 'concentration', toBase: 0.001 },
  'ug/L': { dimension: 'concentration', toBase: 0.001 },
  'g/L': { dimension: 'concentration', toBase: 1000 },
  // In dilute water 1 ppm is taken as 1 mg/L (common practice for wastewater results).
  ppm: { dimension: 'concentration', toBase: 1 },
  SU: { dimension: 'ph', toBase: 1 },
  'gal/day': { dimension: 'flow', toBase: US_GALLON_LITRES },
  MGD: { dimension: 'flow', toBase: 1_000_000 * US_GALLON_LITRES },
  'm³/day': { dimension: 'flow', toBase: 1000 },
  'L/day': { dimension: 'flow', toBase: 1 },
  '°C': { dimension: 'temperature', toBase: 1 },
  '°F': { dimension: 'temperature', toBase: 1 },
  gal: { dimension: 'volume', toBase: US_GALLON_LITRES },
  L: { dimension: 'volume', toBase: 1 },
  // Mass limits (loadings): not measured, computed from a concentration and the day's flow.
  'lb/day': { dimension: 'mass-rate', toBase: POUND_KILOGRAMS },
  'kg/day': { dimension: 'mass-rate', toBase: 1 },
};

export const isMassRate = (unit: string) => units[unit]?.dimension === 'mass-rate';

/**
 * The unit a measurement is carried in for a limit in `limitUnit`: the base unit of what is
 * measured (a mass limit is measured as a concentration; flow is carried in MGD).
 */
export function measuredUnitFor(limitUnit: string): string | null {
  switch (units[limitUnit]?.dimension) {
    case 'concentration':
    case 'mass-rate':
      return 'mg/L';
    case 'ph':
      return 'SU';
    case 'temperature':
      return '°C';
    case 'flow':
      return 'MGD';
    case 'volume':
      return 'L';
    default:
      return null;
  }
}

export function isKnownUnit(unit: string): boolean {
  return unit in units;
}

/** The value in `to`, or null when the two units measure different things. */
export function convert(value: number, from: string, to: string): number | null {
  const source = units[from];
  const target = units[to];
  if (!source || !target || source.dimension !== target.dimension) return null;
  if (from === to) return value;
  if (source.dimension === 'temperature') {
    const celsius = from === '°F' ? ((value - 32) * 5) / 9 : value;
    return to === '°F' ? (celsius * 9) / 5 + 32 : celsius;
  }
  return (value * source.toBase) / target.toBase;
}
