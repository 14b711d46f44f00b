import { loadConfig, localAppDatabaseUrl, localDatabaseUrl, type Config } from '../../server/config/env.js';

/** The test database: `npm test` passes DATABASE_URL; a bare `vitest` falls back to the local cluster. */
export const testDatabaseUrl = process.env.DATABASE_URL ?? localDatabaseUrl(Number(process.env.PGPORT ?? 54329), 'decant_test');

/** The app's least-privileged role on the test database: the app under test runs as it. */
export const testAppDatabaseUrl = process.env.APP_DATABASE_URL ?? localAppDatabaseUrl(Number(process.env.PGPORT ?? 54329), 'decant_test');

export function testConfig(overrides: Partial<Config> = {}): Config {
  return {
    ...loadConfig({ NODE_ENV: 'test', DATABASE_URL: testDatabaseUrl, SESSION_SECRET: 'test-session-secret-0123456789' }),
    ...overrides,
  };
}
