import { Client } from 'pg';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../../helpers/test-app.js';
import { testAppDatabaseUrl, testDatabaseUrl } from '../../helpers/test-env.js';

async function connect(url: string): Promise<Client> {
  const client = new Client({ connectionString: url });
  await client.connect();
  return client;
}

describe('the app runs as a role that cannot bypass the trail', () => {
  let app: Client;
  beforeAll(async () => {
    app = await connect(testAppDatabaseUrl);
  });
  afterAll(() => app.end());

  it('is no superuser and owns no table', async () => {
    const { rows } = await app.query(`SELECT rolsuper FROM pg_roles WHERE rolname = current_user`);
    expect(rows).toEqual([{ rolsuper: false }]);
    const owned = await app.query(`SELECT count(*)::int AS n FROM pg_tables WHERE schemaname = 'public' AND tableowner = current_user`);
    expect(owned.rows).toEqual([{ n: 0 }]);
  });

  it('cannot switch the trail triggers off, three ways', async () => {
    await expect(app.query('ALTER TABLE trail_entry DISABLE TRIGGER ALL')).rejects.toThrow(/must be owner/);
    await expect(app.query('SET session_replication_role = replica')).rejects.toThrow(/permission denied/);
    await expect(app.query('DROP TRIGGER trail_entry_no_update_or_delete ON trail_entry')).rejects.toThrow(/must be owner/);
  });

  it('cannot rewrite, remove or empty the trail, nor move its chain head', async () => {
    await expect(app.query(`UPDATE trail_entry SET action = 'tampered' WHERE id = (SELECT min(id) FROM trail_entry)`)).rejects.toThrow(
      /permission denied/,
    );
    await expect(app.query('DELETE FROM trail_entry')).rejects.toThrow(/permission denied/);
    await expect(app.query('TRUNCATE trail_entry')).rejects.toThrow(/permission denied/);
    await expect(app.query(`UPDATE trail_chain_head SET seq = 0`)).rejects.toThrow(/permission denied/);
  });
});

describe('a trail that proves itself', () => {
  let t: TestApp;
  let owner: Client;
  beforeAll(async () => {
    t = await startTestApp();
    owner = await connect(testDatabaseUrl);
  });
  afterAll(async () => {
    await owner.end();
    await t.close();
  });

  it('catches a change made to a regulated table outside Decant, with what it was before', async () => {
    // A result no signed period holds (a signed period's results are locked, whoever asks).
    const { rows } = await owner.query(
      `SELECT r.id, r.value FROM lab_result r JOIN lab_sample s ON s.id = r.sample_id
        WHERE NOT EXISTS (SELECT 1 FROM reporting_period rp JOIN permit_limit l ON l.permit_id = rp.permit_id
                           WHERE rp.status = 'signed' AND l.discharge_point_id = s.discharge_point_id
                             AND s.collected_on BETWEEN rp.starts_on AND rp.ends_on)
        ORDER BY r.id LIMIT 1`,
    );
    const result = rows[0] as { id: string; value: string };
    await owner.query('BEGIN');
    try {
      await owner.query(`UPDATE lab_result SET value = value + 1 WHERE id = $1`, [result.id]);
      const { rows: entries } = await owner.query(
        `SELECT action, entity, actor_email, before->>'value' AS was, after->>'value' AS now FROM trail_entry
          WHERE entity = 'lab_result' AND entity_id = $1 ORDER BY chain_seq DESC LIMIT 1`,
        [result.id],
      );
      expect(entries).toEqual([
        {
          action: 'update-outside-decant',
          entity: 'lab_result',
          actor_email: 'outside Decant: decant',
          was: result.value,
          now: expect.any(String),
        },
      ]);
    } finally {
      await owner.query('ROLLBACK');
    }
  });

  it('verifies the whole chain for an auditor', async () => {
    const auditor = await t.sessionFor('auditor@decant.test');
    const response = await request(t.app).get('/api/trail/verification').set('cookie', auditor).expect(200);
    expect(response.body).toMatchObject({ intact: true, firstBreak: null });
    expect(response.body.entries).toBeGreaterThan(1000);
    expect(response.body.head.hash).toMatch(/^[0-9a-f]{64}$/);
  });

  it("finds the entry someone with the owner's rights tampered with", async () => {
    await owner.query('BEGIN');
    try {
      await owner.query('ALTER TABLE trail_entry DISABLE TRIGGER trail_entry_no_update_or_delete');
      const { rows } = await owner.query(`UPDATE trail_entry SET after = '{"forged": true}' WHERE chain_seq = 50 RETURNING id`);
      const { rows: found } = await owner.query('SELECT chain_seq::int, id, reason FROM trail_chain_break()');
      expect(found).toEqual([{ chain_seq: 50, id: rows[0].id, reason: 'its content no longer matches its hash' }]);
    } finally {
      await owner.query('ROLLBACK');
    }
    const { rows: after } = await owner.query('SELECT count(*)::int AS n FROM trail_chain_break()');
    expect(after).toEqual([{ n: 0 }]);
  });
});
