import { convert, measuredUnitFor, US_GALLON_LITRES } from '../units.js';

/** A measured value in its limit's unit, or null when it cannot be had (a loading on a day without a flow reading). */
export type ToLimitUnit = (value: number, day: string) => number | null;

/** The day's flow at a point in MGD, when one was recorded. */
export type FlowOn = (dischargePointId: string, day: string) => number | undefined;

const M3_PER_MILLION_GALLONS = 1000 * US_GALLON_LITRES;

/**
 * The operator's formulas: lb/day = MGD × mg/L × factor (8.34 lb per gallon of water, or the
 * permit's 8.3454) and kg/day = m³/day × mg/L / 1000.
 */
export function massLoading(mgd: number, mgPerL: number, factor: number): { lbPerDay: number; kgPerDay: number } {
  return { lbPerDay: mgd * mgPerL * factor, kgPerDay: (mgd * M3_PER_MILLION_GALLONS * mgPerL) / 1000 };
}

const asMeasured: ToLimitUnit = (value) => value;

/**
 * How a measurement (carried in the base unit of what is measured, see `measuredUnitFor`)
 * becomes a figure in the limit's unit. A mass limit turns the day's concentration into a
 * loading with that day's flow (40 CFR 122.2, "daily discharge": for a mass limit, the total
 * mass discharged over the day).
 */
export function toLimitUnit(limit: { dischargePointId: string; unit: string }, flowOn: FlowOn, factor: number): ToLimitUnit {
  const point = limit.dischargePointId;
  if (limit.unit === 'lb/day' || limit.unit === 'kg/day') {
    const pick = limit.unit === 'lb/day' ? 'lbPerDay' : 'kgPerDay';
    return (value, day) => {
      const mgd = flowOn(point, day);
      return mgd === undefined ? null : massLoading(mgd, value, factor)[pick];
    };
  }
  const measured = measuredUnitFor(limit.unit);
  if (measured === null || measured === limit.unit) return asMeasured;
  return (value) => convert(value, measured, limit.unit);
}
