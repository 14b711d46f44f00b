/** The units Decant knows, for contracts (which must not import conversion code). Kept in step with units.ts by a test. */
export const unitNames = ['mg/L', 'µg/L', 'ug/L', 'g/L', 'ppm', 'SU', 'gal/day', 'MGD', 'm³/day', 'L/day', '°C', '°F', 'gal', 'L'];
/** Mass limits (loadings), computed from a concentration and the day's flow; never a result's unit. */
export const massRateUnitNames = ['lb/day', 'kg/day'];
export const limitUnitNames = [...unitNames, ...massRateUnitNames];
