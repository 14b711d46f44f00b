import { createDataSource } from './data-source.js';
import { seedDemo } from './seed/seed-demo.js';

/** Runs pending migrations, then the demo seed. Used by `npm start`, `npm test` and the CLI. */
export async function prepareDatabase(url: string, options: { seed: boolean; reset?: boolean }): Promise<void> {
  const dataSource = createDataSource(url);
  await dataSource.initialize();
  try {
    if (options.reset) {
      await dataSource.query('DROP SCHEMA public CASCADE');
      await dataSource.query('CREATE SCHEMA public');
    }
    const applied = await dataSource.runMigrations({ transaction: 'each' });
    if (applied.length > 0) console.log(`Applied migrations: ${applied.map((m) => m.name).join(', ')}`);
    if (options.seed) await seedDemo(dataSource);
  } finally {
    await dataSource.destroy();
  }
}
