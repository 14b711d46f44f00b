import { createHmac, randomBytes } from 'node:crypto';
import pg from 'pg';
import type { DataSource } from 'typeorm';
import { createApp } from '../../server/app.js';
import { sessionCookieName } from '../../server/auth/session.js';
import type { Config } from '../../server/config/env.js';
import { createDataSource } from '../../server/db/data-source.js';
import { testAppDatabaseUrl, testConfig } from './test-env.js';

export interface TestApp {
  app: ReturnType<typeof createApp>;
  dataSource: DataSource;
  config: Config;
  /** A session cookie for a seeded user, stored in the real session table. */
  sessionFor(email: string, signedInAt?: number): Promise<string>;
  count(table: string): Promise<number>;
  close(): Promise<void>;
}

export async function startTestApp(overrides: Partial<Config> = {}): Promise<TestApp> {
  const config = testConfig(overrides);
  // The app under test runs as the app's least-privileged role, as it does in production.
  const dataSource = await createDataSource(testAppDatabaseUrl, { asApp: true }).initialize();
  const sessionPool = new pg.Pool({ connectionString: testAppDatabaseUrl, max: 2 });
  const app = createApp({ config, dataSource, sessionPool });

  /** A signed-in session cookie for a demo person; `signedInAt` backdates the sign-in. */
  async function sessionFor(email: string, signedInAt = Date.now()): Promise<string> {
    const [user] = await dataSource.query('SELECT id FROM app_user WHERE email = $1', [email]);
    if (!user) throw new Error(`No user ${email}`);
    const sid = randomBytes(18).toString('base64url');
    const expires = new Date(Date.now() + 3600_000);
    const sess = {
      cookie: { originalMaxAge: 3600_000, expires, httpOnly: true, path: '/', sameSite: 'lax' },
      userId: user.id,
      signedInAt,
    };
    await dataSource.query('INSERT INTO session (sid, sess, expire) VALUES ($1, $2, $3)', [sid, JSON.stringify(sess), expires]);
    // The same signature express-session (cookie-signature) puts on its cookie.
    const mac = createHmac('sha256', config.sessionSecret).update(sid).digest('base64').replace(/=+$/, '');
    return `${sessionCookieName}=${encodeURIComponent(`s:${sid}.${mac}`)}`;
  }

  async function count(table: string): Promise<number> {
    const [row] = await dataSource.query(`SELECT count(*)::int AS n FROM ${table}`);
    return row.n;
  }

  return {
    app,
    dataSource,
    config,
    sessionFor,
    count,
    close: async () => {
      await sessionPool.end();
      await dataSource.destroy();
    },
  };
}
