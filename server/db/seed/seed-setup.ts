import { DateTime } from 'luxon';
import type { EntityManager } from 'typeorm';

/** Discharge points, one pretreatment permit per site, and their limits. Idempotent by natural keys. */
const points = {
  north: [
    { code: 'OF-001', name: 'Outfall to the town sewer, east manhole', receiving: 'sewer' },
    { code: 'IS-101', name: 'Separator effluent, internal sampling tap', receiving: 'sewer' },
  ],
  east: [
    { code: 'OF-002', name: 'Outfall to the town sewer, Mill Race Lane', receiving: 'sewer' },
    { code: 'IS-201', name: 'Wash-line sump discharge, internal', receiving: 'sewer' },
  ],
} as const;

const permits = {
  north: { number: 'TCU-IU-0417', outfall: 'OF-001', flowLimit: 60000, oilLoadingLimit: 60 },
  east: { number: 'TCU-IU-0522', outfall: 'OF-002', flowLimit: 25000, oilLoadingLimit: null },
} as const;

export async function seedSetup(manager: EntityManager, siteIds: Record<'north' | 'east', string>): Promise<void> {
  // The demo permits took effect when the demo's 18 months of records begin.
  const effectiveFrom = DateTime.now().setZone('America/Chicago').startOf('month').minus({ months: 17 }).toISODate();
  const parameter = async (code: string) =>
    (await manager.query('SELECT id FROM parameter WHERE site_id IS NULL AND code = $1', [code]))[0].id as string;
  const hem = await parameter('oil-grease-hem');
  const ph = await parameter('ph');
  const flow = await parameter('flow');

  for (const key of ['north', 'east'] as const) {
    const siteId = siteIds[key];
    for (const point of points[key]) {
      await manager.query(
        `INSERT INTO discharge_point (site_id, code, name, receiving) VALUES ($1, $2, $3, $4) ON CONFLICT (site_id, code) DO NOTHING`,
        [siteId, point.code, point.name, point.receiving],
      );
    }
    const spec = permits[key];
    const existing = await manager.query('SELECT id FROM permit WHERE site_id = $1 AND number = $2', [siteId, spec.number]);
    if (existing.length > 0) continue;
    const [permit] = await manager.query(
      `INSERT INTO permit (site_id, kind, number, issuing_authority, authority_email, effective_from, effective_to, reporting_frequency,
         report_due_days)
       VALUES ($1, 'pretreatment', $2, 'Tamsin Creek Utilities, Pretreatment Office', 'pretreatment@tamsincreek-utilities.test',
         $3, '2030-06-30', 'semiannual', 30) RETURNING id`,
      [siteId, spec.number, effectiveFrom],
    );
    await manager.query(
      `INSERT INTO permit_settings (permit_id, applies_from, non_detect_policy, daily_max_applies_to_each_grab, mass_loading_factor, snc_window,
         late_report_days, monitoring_counts)
       VALUES ($1, $2, 'zero', false, 8.34, 'calendar-halves', 45, 'sampling-days')`,
      [permit.id, effectiveFrom],
    );
    const [outfall] = await manager.query('SELECT id FROM discharge_point WHERE site_id = $1 AND code = $2', [siteId, spec.outfall]);
    const limits: Array<[string, string, number, string, number, string, string]> = [
      [hem, 'daily-maximum', 100, 'mg/L', 2, 'month', 'grab'],
      [hem, 'monthly-average', 50, 'mg/L', 2, 'month', 'grab'],
      [ph, 'instantaneous-minimum', 5.5, 'SU', 2, 'month', 'grab'],
      [ph, 'instantaneous-maximum', 10.5, 'SU', 2, 'month', 'grab'],
      [flow, 'daily-maximum', spec.flowLimit, 'gal/day', 5, 'week', 'composite'],
    ];
    // The north permit also caps the oil and grease loading (lb/day), worked out from the day's flow.
    if (spec.oilLoadingLimit !== null) limits.push([hem, 'daily-maximum', spec.oilLoadingLimit, 'lb/day', 2, 'month', 'grab']);
    for (const [parameterId, statistic, value, unit, count, per, sampleType] of limits) {
      await manager.query(
        `INSERT INTO permit_limit (permit_id, discharge_point_id, parameter_id, statistic, value, unit, frequency_count, frequency_per, sample_type)
         VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9)`,
        [permit.id, outfall.id, parameterId, statistic, value, unit, count, per, sampleType],
      );
    }
  }
}
