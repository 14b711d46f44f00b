import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client } from 'pg';
import { startTestApp, type TestApp } from '../helpers/test-app.js';
import { testDatabaseUrl } from '../helpers/test-env.js';

/** One statement on a connection of the tables' owner, outside the app. */
async function asOwner(sql: string): Promise<unknown> {
  const client = new Client({ connectionString: testDatabaseUrl });
  await client.connect();
  try {
    return (await client.query(sql)).rows;
  } finally {
    await client.end();
  }
}

describe('the trail', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
    // At least one entry to attack.
    await t.dataSource.query(
      `INSERT INTO trail_entry (actor_email, action, entity, entity_id, after) VALUES ('test@decant.test', 'create', 'probe', 'p1', '{"a":1}')`,
    );
  });
  afterAll(() => t.close());

  // The app's role lacks the privilege; the owner, who has it, is stopped by the triggers.
  it('refuses UPDATE, DELETE and TRUNCATE to the app, and to the owner', async () => {
    for (const statement of [`UPDATE trail_entry SET action = 'tampered'`, 'DELETE FROM trail_entry', 'TRUNCATE trail_entry']) {
      await expect(t.dataSource.query(statement)).rejects.toThrow(/permission denied/);
      await expect(asOwner(statement)).rejects.toThrow(/append-only/);
    }
    expect(await t.count('trail_entry')).toBeGreaterThan(0);
  });

  it('reads in words and exports the filtered trail as CSV, text neutralised so it never runs as a formula', async () => {
    const coordinator = await t.sessionFor('coordinator@decant.test');
    const [site] = await t.dataSource.query(`SELECT id FROM site WHERE name = 'Tamsin Creek Works'`);
    const point = await request(t.app)
      .post(`/api/sites/${site.id}/discharge-points`)
      .set('cookie', coordinator)
      .send({ code: 'TR-1', name: '=HYPERLINK("http://example.invalid")', receiving: 'sewer' })
      .expect(201);
    await request(t.app)
      .patch(`/api/sites/${site.id}/discharge-points/${point.body.id}`)
      .set('cookie', coordinator)
      .send({ name: 'Trail outfall' })
      .expect(200);
    const today = new Date().toISOString().slice(0, 10);
    const listed = await request(t.app)
      .get(`/api/trail?entity=discharge-point&person=Priya&from=${today}&siteId=${site.id}`)
      .set('cookie', coordinator)
      .expect(200);
    expect(listed.body.items.length).toBeGreaterThanOrEqual(2);
    expect(
      listed.body.items.every(
        (e: { entity: string; actorName: string }) => e.entity === 'discharge-point' && e.actorName === 'Priya Raman',
      ),
    ).toBe(true);
    const csv = await request(t.app)
      .get(`/api/trail/export.csv?entity=discharge-point&from=${today}&siteId=${site.id}`)
      .set('cookie', coordinator)
      .expect(200)
      .expect('content-type', /text\/csv/);
    const lines = csv.text
      .replace(/^\ufeff/, '')
      .trim()
      .split('\r\n');
    expect(lines[0]).toBe('"when (site time)","who","action","record kind","record","changes","reason","amendment","chain seq","hash"');
    const changed = lines.find((line) => line.includes('"Changed"') && line.includes('TR-1'))!;
    expect(changed).toContain('"Discharge point"');
    expect(changed).toContain('Priya Raman <coordinator@decant.test>');
    expect(changed).toContain(`name: =HYPERLINK(""http://example.invalid"") → Trail outfall`);
    const created = lines.find((line) => line.includes('"Created"') && line.includes('TR-1'))!;
    // Each field starts a line of its own text; a field that would start with "=" gets an apostrophe.
    expect(created).not.toMatch(/,"=/);
    await request(t.app)
      .get('/api/trail/export.csv')
      .set('cookie', await t.sessionFor('operator@decant.test'))
      .expect(403);
  });

  it('lists entries newest first, for roles that may read it', async () => {
    const auditor = await t.sessionFor('auditor@decant.test');
    const response = await request(t.app).get('/api/trail?pageSize=5').set('cookie', auditor).expect(200);
    expect(response.body.total).toBeGreaterThan(0);
    const times = response.body.items.map((entry: { occurredAt: string }) => entry.occurredAt);
    expect([...times].sort().reverse()).toEqual(times);
  });

  it('shows a coordinator only the entries of their sites', async () => {
    const east = await t.sessionFor('coordinator.east@decant.test');
    const response = await request(t.app).get('/api/trail').set('cookie', east).expect(200);
    // The probe entry and the user changes belong to no site.
    expect(response.body.items.every((entry: { siteId: string | null }) => entry.siteId !== null)).toBe(true);
  });
});
