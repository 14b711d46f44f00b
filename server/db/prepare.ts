import { ensureQueues } from '../kernel/jobs/queues.js';
import { grantAppRole } from './app-role.js';
import { createDataSource } from './data-source.js';
import { seedDemo, type SeedMode } from './seed/seed-demo.js';

const seedOutcomes = {
  seeded: 'Added the demo company, its sites, people and records.',
  'not-empty': 'The database already holds records: the demo seed left it as it is (npm run db:seed adds the demo company beside them).',
  'already-there': 'The demo company is already there: the demo seed changed nothing.',
};

/**
 * Runs pending migrations as the owner (`url`), gives the app's role (the user of
 * `appDatabaseUrl`, when it is another) its privileges, then, when asked, the demo seed (see
 * `seedDemo` for when it adds anything). Used by `npm start`, `npm test` and the CLI.
 */
export async function prepareDatabase(
  url: string,
  options: { seed: SeedMode | false; reset?: boolean; appDatabaseUrl?: string; signOff?: boolean },
): Promise<void> {
  const dataSource = createDataSource(url);
  await dataSource.initialize();
  try {
    if (options.reset) {
      await dataSource.query('DROP SCHEMA public CASCADE');
      await dataSource.query('DROP SCHEMA IF EXISTS pgboss CASCADE');
      await dataSource.query('CREATE SCHEMA public');
    }
    const applied = await dataSource.runMigrations({ transaction: 'each' });
    if (applied.length > 0) console.log(`Applied migrations: ${applied.map((m) => m.name).join(', ')}`);
    await ensureQueues(url);
    const appRole = options.appDatabaseUrl ? decodeURIComponent(new URL(options.appDatabaseUrl).username) : null;
    if (appRole && appRole !== decodeURIComponent(new URL(url).username)) await grantAppRole(dataSource, appRole);
    if (options.seed) console.log(seedOutcomes[await seedDemo(dataSource, options.seed, { signOff: options.signOff ?? true })]);
  } finally {
    await dataSource.destroy();
  }
}
