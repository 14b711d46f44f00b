/**
 * Unit conversion for results, limits and flows. Each unit belongs to one dimension and has a
 * factor to that dimension's base unit. 1 US gal = 3.785411784 L (exact, NIST Handbook 44).
 */
const US_GALLON_LITRES = 3.785411784;

interface UnitDefinition {
  dimension: 'concentration' | 'flow' | 'ph' | 'temperature' | 'volume';
  /** Multiply by this to reach the base unit (mg/L, L/day, SU, L). Temperature is affine, handled apart. */
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
};


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
