import { resolve } from 'node:path';
import pg from 'pg';
import { createApp } from './app.js';
import { loadConfig } from './config/env.js';
import { createDataSource } from './db/data-source.js';
import { ensureAllPeriods } from './features/periods/periods.service.js';
import { queueDailyDigests } from './features/notices/daily-digest.js';
import { sweepDeadlines } from './features/notices/deadline-sweep.js';
import { dropUnclaimedUploads } from './kernel/files/stored-files.js';
import { startJobs } from './kernel/jobs/jobs.js';
import { deliverPendingMail } from './kernel/mail/deliver-mail.js';
import { createMailTransport } from './kernel/mail/transport.js';

const config = loadConfig();
// The app runs as its least-privileged role; migrations ran before, as the owner.
const dataSource = await createDataSource(config.appDatabaseUrl, { asApp: true }).initialize();
const sessionPool = new pg.Pool({ connectionString: config.appDatabaseUrl, max: 4 });
const app = createApp({ config, dataSource, sessionPool, clientDir: resolve(import.meta.dirname, '../dist') });

// Reporting periods begin with the calendar, not with a request: create them now, then hourly.
await ensureAllPeriods(dataSource).catch((error) => console.error('Creating reporting periods failed:', error));
const mail = { transport: createMailTransport(config.smtpUrl), from: config.mailFrom, appUrl: config.appUrl, secret: config.sessionSecret };
// Scheduled work runs as jobs in the database: however many instances run, each job runs once.
const jobs = await startJobs(config.appDatabaseUrl, {
  'create-periods': () => ensureAllPeriods(dataSource),
  // Uploads no record claimed within a day (a photo of a check never saved) are dropped.
  'drop-stale-uploads': () => dropUnclaimedUploads(dataSource.manager),
  'deadline-sweep': () => sweepDeadlines(dataSource),
  'deliver-mail': () => deliverPendingMail(dataSource, mail),
  'daily-digest': () => queueDailyDigests(dataSource),
});

const server = app.listen(config.port, config.host, () => {
  console.log(`Decant app listening on ${config.appUrl}`);
});

async function shutdown(signal: string): Promise<void> {
  console.log(`Decant app: ${signal}, closing`);
  server.close();
  server.closeAllConnections();
  await jobs.stop().catch(() => undefined);
  await Promise.allSettled([sessionPool.end(), dataSource.destroy()]);
  process.exit(0);
}
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('unhandledRejection', (reason) => {
  console.error('Unhandled rejection:', reason);
  process.exitCode = 1;
});
