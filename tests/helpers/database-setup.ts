import { prepareDatabase } from '../../server/db/prepare.js';
import { testAppDatabaseUrl, testDatabaseUrl } from './test-env.js';

/** Vitest global setup: a clean schema, every migration, and the demo seed, once per run. */
export default async function setup(): Promise<void> {
  // The demo's finished periods stay drafts here: the tests write into its past months, which a
  // signature would lock. tests/server/db/demo-seed-sign-off.spec.ts checks the signed demo.
  await prepareDatabase(testDatabaseUrl, { seed: 'when-empty', reset: true, appDatabaseUrl: testAppDatabaseUrl, signOff: false });
}
