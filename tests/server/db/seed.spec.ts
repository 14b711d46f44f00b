import { DateTime } from 'luxon';
import { Client } from 'pg';
import type { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDataSource } from '../../../server/db/data-source.js';
import { prepareDatabase } from '../../../server/db/prepare.js';
import { seedDemo } from '../../../server/db/seed/seed-demo.js';
import { seedActor } from '../../../server/db/seed/seed-trail.js';
import { testDatabaseUrl } from '../../helpers/test-env.js';

// A database of someone else's records: the demo seed must leave every one of them as it was.
const probeName = `decant_seed_probe_${process.pid}`;
const probeUrl = Object.assign(new URL(testDatabaseUrl), { pathname: `/${probeName}` }).toString();

async function onServer(sql: string): Promise<void> {
  const client = new Client({ connectionString: testDatabaseUrl });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

describe('the demo seed never touches real data', () => {
  let dataSource: DataSource;
  let otherSiteId: string;
  const snapshot = async () =>
    dataSource.query(
      `SELECT (SELECT json_agg(f ORDER BY f.id) FROM follow_up f WHERE f.site_id = $1) AS follow_ups,
              (SELECT json_agg(r ORDER BY r.id) FROM reporting_period r JOIN permit p ON p.id = r.permit_id WHERE p.site_id = $1) AS periods,
              (SELECT json_agg(p ORDER BY p.id) FROM permit p WHERE p.site_id = $1) AS permits,
              (SELECT count(*)::int FROM trail_entry WHERE site_id = $1) AS trail`,
      [otherSiteId],
    );

  beforeAll(async () => {
    await onServer(`DROP DATABASE IF EXISTS ${probeName}`);
    await onServer(`CREATE DATABASE ${probeName}`);
    await prepareDatabase(probeUrl, { seed: false });
    dataSource = await createDataSource(probeUrl).initialize();
    // A real company's site, an overdue notice to the control authority still open, and a
    // past period whose report was never recorded as sent.
    const [{ id: companyId }] = await dataSource.query(`INSERT INTO company (name) VALUES ('Fixture Works Ltd') RETURNING id`);
    [{ id: otherSiteId }] = await dataSource.query(
      `INSERT INTO site (company_id, name, time_zone) VALUES ($1, 'Fixture plant', 'America/New_York') RETURNING id`,
      [companyId],
    );
    const [{ id: permitId }] = await dataSource.query(
      `INSERT INTO permit (site_id, kind, number, issuing_authority, effective_from, reporting_frequency, report_due_days)
       VALUES ($1, 'pretreatment', 'FX-1', 'Fixture authority', '2024-01-01', 'semiannual', 30)
       RETURNING id`,
      [otherSiteId],
    );
    await dataSource.query(
      `INSERT INTO permit_settings (permit_id, applies_from, non_detect_policy, mass_loading_factor, snc_window) VALUES ($1, '2024-01-01', 'zero', 8.34, 'calendar-halves')`,
      [permitId],
    );
    await dataSource.query(
      `INSERT INTO reporting_period (permit_id, starts_on, ends_on, due_on) VALUES ($1, '2024-01-01', '2024-06-30', '2024-07-30')`,
      [permitId],
    );
    await dataSource.query(
      `INSERT INTO follow_up (site_id, kind, source_entity, source_id, title, due_at)
       VALUES ($1, 'notify-control-authority', 'lab-result', gen_random_uuid(), 'Notify the authority', $2)`,
      [otherSiteId, DateTime.now().minus({ days: 90 }).toJSDate()],
    );
  }, 60_000);

  afterAll(async () => {
    await dataSource?.destroy();
    await onServer(`DROP DATABASE IF EXISTS ${probeName}`);
  });

  it('adds nothing at start-up to a database that already holds records', async () => {
    const before = await snapshot();
    expect(await seedDemo(dataSource, 'when-empty')).toBe('not-empty');
    expect(await dataSource.query('SELECT count(*)::int AS n FROM company')).toEqual([{ n: 1 }]);
    expect(await dataSource.query('SELECT count(*)::int AS n FROM app_user')).toEqual([{ n: 0 }]);
    expect(await snapshot()).toEqual(before);
  });

  it('asked explicitly, adds the demo company beside them, twice over, and changes none of their rows', async () => {
    const before = await snapshot();
    expect(await seedDemo(dataSource, 'explicit')).toBe('seeded');
    const afterFirst = await dataSource.query(
      `SELECT (SELECT count(*)::int FROM trail_entry) AS trail, (SELECT count(*)::int FROM lab_result) AS results`,
    );
    expect(await seedDemo(dataSource, 'explicit')).toBe('already-there');
    expect(await snapshot()).toEqual(before);
    expect(before[0].follow_ups[0].status).toBe('open');
    expect(before[0].periods[0].submitted_on).toBeNull();
    expect(
      await dataSource.query(`SELECT (SELECT count(*)::int FROM trail_entry) AS trail, (SELECT count(*)::int FROM lab_result) AS results`),
    ).toEqual(afterFirst);
  }, 120_000);

  it('writes what it created to the trail, as the seed', async () => {
    const byEntity: Array<{ entity: string; n: number }> = await dataSource.query(
      `SELECT entity, count(*)::int AS n FROM trail_entry WHERE actor_email = $1 AND action = 'create' GROUP BY entity ORDER BY entity`,
      [seedActor],
    );
    const counted = Object.fromEntries(byEntity.map((row) => [row.entity, row.n]));
    const [tables] = await dataSource.query(
      `SELECT (SELECT count(*)::int FROM lab_certificate) AS certificates, (SELECT count(*)::int FROM oil_log_entry) AS oil,
              (SELECT count(*)::int FROM shipment) AS shipments, (SELECT count(*)::int FROM app_user) AS people,
              (SELECT count(*)::int FROM permit) - 1 AS permits`,
    );
    expect(counted['lab-certificate']).toBe(tables.certificates);
    expect(counted['oil-log-entry']).toBe(tables.oil);
    expect(counted['shipment']).toBe(tables.shipments);
    expect(counted['user']).toBe(tables.people);
    expect(counted['permit']).toBe(tables.permits);
    // The compiles and closings the seed made are its own: only the signatures (and the one
    // amendment) are the demo coordinator's, as a signature must be a person's.
    expect(
      await dataSource.query(`SELECT DISTINCT actor_email, action FROM trail_entry WHERE actor_email LIKE '%@decant.test' ORDER BY action`),
    ).toEqual([
      { actor_email: 'coordinator@decant.test', action: 'amend' },
      { actor_email: 'coordinator@decant.test', action: 'compile' },
      { actor_email: 'coordinator@decant.test', action: 'sign' },
    ]);
  });

  it('shows every state of a period on first start: signed, draft, and amended to revision 2', async () => {
    const states: Array<{ status: string; finished: boolean; n: number }> = await dataSource.query(
      `SELECT rp.status, rp.ends_on < (now() AT TIME ZONE s.time_zone)::date AS finished, count(*)::int AS n
         FROM reporting_period rp JOIN permit p ON p.id = rp.permit_id JOIN site s ON s.id = p.site_id JOIN company c ON c.id = s.company_id
        WHERE c.name <> 'Fixture Works Ltd' GROUP BY 1, 2 ORDER BY 1, 2`,
    );
    // Every finished period is signed; the running ones are drafts.
    expect(states.filter((row) => row.finished).map((row) => row.status)).toEqual(['signed']);
    expect(states.filter((row) => !row.finished).map((row) => row.status)).toEqual(['compiled']);
    const [amended] = await dataSource.query(
      `SELECT s.revision, s.signer_name, s.statement_section, a.reason FROM period_signature s JOIN period_amendment a ON a.id = s.amendment_id`,
    );
    expect(amended).toMatchObject({ revision: 2, signer_name: 'Priya Raman', statement_section: '40 CFR 403.6(a)(2)(ii)' });
    expect(amended.reason).toMatch(/flow meter was recalibrated/);
    // The fixture company's period is left as it was: unsigned.
    expect(await dataSource.query(`SELECT status FROM reporting_period WHERE starts_on = '2024-01-01'`)).toEqual([{ status: 'open' }]);
  });
});
