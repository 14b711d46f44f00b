import { resolve } from 'node:path';
import pg from 'pg';
import { createApp } from './app.js';
import { loadConfig } from './config/env.js';
import { createDataSource } from './db/data-source.js';
import { ensureAllPeriods } from './features/periods/periods.service.js';
import { dropUnclaimedUploads } from './kernel/files/stored-files.js';

const config = loadConfig();
// The app runs as its least-privileged role; migrations ran before, as the owner.
const dataSource = await createDataSource(config.appDatabaseUrl, { asApp: true }).initialize();
const sessionPool = new pg.Pool({ connectionString: config.appDatabaseUrl, max: 4 });
const app = createApp({ config, dataSource, sessionPool, clientDir: resolve(import.meta.dirname, '../dist') });

// Reporting periods begin with the calendar, not with a request: create them now and hourly.
const createDuePeriods = () => ensureAllPeriods(dataSource).catch((error) => console.error('Creating reporting periods failed:', error));
// Uploads no record claimed within a day (a photo of a check never saved) are dropped hourly too.
const dropStaleUploads = () =>
  dropUnclaimedUploads(dataSource.manager).catch((error) => console.error('Dropping unclaimed uploads failed:', error));
await createDuePeriods();
setInterval(() => void Promise.all([createDuePeriods(), dropStaleUploads()]), 60 * 60 * 1000).unref();

const server = app.listen(config.port, config.host, () => {
  console.log(`Decant app listening on ${config.appUrl}`);
});

async function shutdown(signal: string): Promise<void> {
  console.log(`Decant app: ${signal}, closing`);
  server.close();
  server.closeAllConnections();
  await Promise.allSettled([sessionPool.end(), dataSource.destroy()]);
  process.exit(0);
}
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('unhandledRejection', (reason) => {
  console.error('Unhandled rejection:', reason);
  process.exitCode = 1;
});
