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
