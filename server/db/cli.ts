import { loadConfig } from '../config/env.js';
import { prepareDatabase } from './prepare.js';

// `npm run db:migrate` / `npm run db:seed` against DATABASE_URL (or the local cluster).
const command = process.argv[2];
const config = loadConfig();
if (command !== 'migrate' && command !== 'seed') {
  console.error('usage: cli.ts migrate|seed');
  process.exit(2);
}
await prepareDatabase(config.databaseUrl, { seed: command === 'seed' ? 'explicit' : false, appDatabaseUrl: config.appDatabaseUrl });
