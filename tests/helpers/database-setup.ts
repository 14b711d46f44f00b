import { prepareDatabase } from '../../server/db/prepare.js';
import { testAppDatabaseUrl, testDatabaseUrl } from './test-env.js';

/** Vitest global setup: a clean schema, every migration, and the demo seed, once per run. */
export default async function setup(): Promise<void> {
  await prepareDatabase(testDatabaseUrl, { seed: 'when-empty', reset: true, appDatabaseUrl: testAppDatabaseUrl });
}
