import type { DataSource } from 'typeorm';

// The benches' busy site: 10 discharge points × 6 parameters, each sampled daily, with daily
// flows if asked. Fixture data for measurements, written straight to the database.
export const POINTS = 10;
export const PARAMETERS = 6;

export interface BenchSite {
  periodId: string;
  siteId: string;
  certificateId: string;
}

export async function setUpBenchSite(db: DataSource): Promise<BenchSite> {
  const [company] = await db.query(`INSERT INTO company (name) VALUES ('Bench Co') RETURNING id`);
  const [site] = await db.query(
    `INSERT INTO site (company_id, name, time_zone) VALUES ($1, 'Bench site', 'America/Chicago') RETURNING id`,
    [company.id],
  );
  const [user] = await db.query(
    `INSERT INTO app_user (email, name, role) VALUES ('bench@decant.test', 'Bench', 'coordinator') RETURNING id`,
  );
  const [permit] = await db.query(
    `INSERT INTO permit (site_id, kind, number, issuing_authority, effective_from, reporting_frequency, report_due_days)
     VALUES ($1, 'pretreatment', 'BENCH-1', 'Bench authority', '2000-01-01', 'semiannual', 30) RETURNING id`,
    [site.id],
  );
  await db.query(
    `INSERT INTO permit_settings (permit_id, applies_from, non_detect_policy, mass_loading_factor, snc_window) VALUES ($1, '2000-01-01', 'zero', 8.34, 'calendar-halves')`,
    [permit.id],
  );
  await db.query(
    `INSERT INTO parameter (site_id, code, name, default_unit, snc_review_factor)
    SELECT $1, 'bench-' || g, 'Bench parameter ' || g, 'mg/L', 1.2 FROM generate_series(1, ${PARAMETERS}) g`,
    [site.id],
  );
  await db.query(
    `INSERT INTO discharge_point (site_id, code, name, receiving) SELECT $1, 'BP-' || g, 'Bench point ' || g, 'sewer' FROM generate_series(1, ${POINTS}) g`,
    [site.id],
  );
  await db.query(
    `INSERT INTO permit_limit (permit_id, discharge_point_id, parameter_id, statistic, value, unit, frequency_count, frequency_per, sample_type)
     SELECT $1, d.id, p.id, s.statistic, 100, 'mg/L', 1, 'day', 'grab'
       FROM discharge_point d, parameter p, (VALUES ('daily-maximum'), ('monthly-average')) s(statistic) WHERE d.site_id = $2 AND p.site_id = $2`,
    [permit.id, site.id],
  );
  const [certificate] = await db.query(
    `INSERT INTO lab_certificate (site_id, lab_name, lab_accreditation_number, report_number, received_on, created_by) VALUES ($1, 'Bench', 'B', 'B-1', '2026-01-01', $2) RETURNING id`,
    [site.id, user.id],
  );
  const [period] = await db.query(
    `INSERT INTO reporting_period (permit_id, starts_on, ends_on, due_on) VALUES ($1, '2025-01-01', '2025-12-31', '2026-01-30') RETURNING id`,
    [permit.id],
  );
  return { periodId: period.id, siteId: site.id, certificateId: certificate.id };
}

/** Daily samples at every point, each with a result for every parameter, over `years` ending 2025-12-31. */
export async function addHistory(db: DataSource, siteId: string, certificateId: string, fromYear: number, toYear: number): Promise<void> {
  // Fixture rows, written as the app writes (decant.via_app): the database's watch on changes made
  // outside Decant would otherwise write a trail entry, hashed into the chain, for every row.
  await db.transaction(async (manager) => {
    await manager.query(`SET LOCAL decant.via_app = 'on'`);
    await manager.query(
      `WITH s AS (
       INSERT INTO lab_sample (certificate_id, discharge_point_id, collected_at, collected_on, collected_by, sample_type, preservation_confirmed)
       SELECT $2, d.id, day + time '09:00', day, 'bench', 'grab', true
         FROM discharge_point d, generate_series(make_date($3, 1, 1), make_date($4, 12, 31), interval '1 day') day
        WHERE d.site_id = $1
       RETURNING id)
     INSERT INTO lab_result (sample_id, parameter_id, method, value_reported, value, unit)
     SELECT s.id, p.id, '1664B', '42', 20 + random() * 60, 'mg/L' FROM s, parameter p WHERE p.site_id = $1`,
      [siteId, certificateId, fromYear, toYear],
    );
  });
  await db.query('ANALYZE lab_sample; ANALYZE lab_result');
}

/** A flow reading a day at every point over the given years, as the app writes them. */
export async function addDailyFlows(db: DataSource, siteId: string, fromYear: number, toYear: number): Promise<void> {
  await db.transaction(async (manager) => {
    await manager.query(`SET LOCAL decant.via_app = 'on'`);
    await manager.query(
      `INSERT INTO flow_reading (discharge_point_id, day, value, unit)
       SELECT d.id, day, 20000 + random() * 10000, 'gal/day'
         FROM discharge_point d, generate_series(make_date($2, 1, 1), make_date($3, 12, 31), interval '1 day') day
        WHERE d.site_id = $1`,
      [siteId, fromYear, toYear],
    );
  });
}

/**
 * Median times of several measured calls, taken in turns (a, b, c, a, b, c, …) so that a busy
 * moment of the machine falls on all of them alike.
 */
export async function timeInTurns(calls: Array<() => Promise<unknown>>, runs = 15): Promise<number[]> {
  for (const call of calls) await call();
  const times = calls.map(() => [] as number[]);
  for (let run = 0; run < runs; run++) {
    for (const [index, call] of calls.entries()) {
      const started = performance.now();
      await call();
      times[index]!.push(performance.now() - started);
    }
  }
  return times.map((list) => list.sort((a, b) => a - b)[Math.floor(runs / 2)]!);
}
