import { resolve } from 'node:path';
import { loadConfig } from '../config/env.js';
import { demoPassword, demoPeople } from '../db/seed/demo-scenario.js';
import { prepareDatabase } from '../db/prepare.js';
import { waitForFreePorts } from './free-ports.js';
import { localDatabase } from './local-database.js';
import { run, startCommand, startTypeScript, stopChildren } from './processes.js';

// `npm start` (and `npm run dev` with --dev): database, migrations, seed, then the test identity
// provider, the mail inbox and the app, each in its own process. Ctrl-C stops all of them.
const projectDir = resolve(import.meta.dirname, '../..');
const dev = process.argv.includes('--dev');
const config = loadConfig();
const vitePort = Number(process.env.VITE_PORT ?? 4283);
const appUrl = dev ? `http://127.0.0.1:${vitePort}` : config.appUrl;

// A previous run that crashed may still hold its ports for a moment.
const ports = [{ port: config.port, name: 'the app' }];
if (config.oidc.isLocalFake && !process.env.OIDC_ISSUER)
  ports.push({ port: Number(new URL(config.oidc.issuer).port), name: 'the test identity provider' });
if (config.mailInboxUrl) {
  ports.push({ port: Number(new URL(config.smtpUrl).port), name: 'the mail inbox (SMTP)' });
  ports.push({ port: Number(new URL(config.mailInboxUrl).port), name: 'the mail inbox (web)' });
}
if (dev) ports.push({ port: vitePort, name: 'Vite' });
await waitForFreePorts(ports, config.host);

// Demo mode (the demo company, its people and the demo sign-in list) is for the project's own
// cluster; a database named by DATABASE_URL gets it only when DEMO=true asks for it.
const demo = process.env.DEMO ? process.env.DEMO === 'true' : !process.env.DATABASE_URL;
const database = await localDatabase(projectDir, 'decant');
try {
  await prepareDatabase(database.url, { seed: demo ? 'when-empty' : false, appDatabaseUrl: database.appUrl });
  if (!dev) {
    console.log('Building the client…');
    run(resolve(projectDir, 'node_modules/.bin/vite'), ['build', '--logLevel', 'warn'], { cwd: projectDir });
  }
} catch (error) {
  // Leave nothing running behind a failed start.
  if (database.cluster?.startedHere) database.cluster.stop();
  throw error;
}

const shared = {
  DATABASE_URL: database.url,
  APP_DATABASE_URL: database.appUrl,
  APP_URL: appUrl,
  NODE_ENV: dev ? 'development' : 'production',
  DEMO: String(demo),
};
if (config.oidc.isLocalFake && !process.env.OIDC_ISSUER) {
  startTypeScript('idp/main.ts', { APP_URLS: appUrl, IDP_PORT: String(new URL(config.oidc.issuer).port) });
}
if (config.mailInboxUrl) startTypeScript('server/dev/mail-inbox-main.ts', {});
// Production mode needs a session secret; the local demo uses a fixed one unless one is set.
startTypeScript('server/index.ts', { ...shared, SESSION_SECRET: config.sessionSecret }, dev ? ['--watch'] : []);
if (dev) startCommand(resolve(projectDir, 'node_modules/.bin/vite'), ['--port', String(vitePort), '--strictPort'], {});

function demoAccounts(): string {
  if (!demo) return '';
  const width = Math.max(...demoPeople.map((person) => person.email.length));
  const lines = demoPeople.map((p) => `    ${p.email.padEnd(width)}  ${p.role.padEnd(13)}  ${p.duty}`);
  return `\n  Demo accounts (password: ${demoPassword})\n${lines.join('\n')}\n`;
}

const inboxLine = config.mailInboxUrl ? `\n  Mail it sends: ${config.mailInboxUrl}\n` : '';
setTimeout(() => console.log(`\n  Decant is running at ${appUrl}\n${inboxLine}${demoAccounts()}\n  Press Ctrl-C to stop.`), 2500);

let stopping = false;
async function stop(): Promise<void> {
  if (stopping) return;
  stopping = true;
  console.log('\nStopping…');
  await stopChildren();
  if (database.cluster?.startedHere) database.cluster.stop();
  process.exit(0);
}
process.on('SIGINT', () => void stop());
process.on('SIGTERM', () => void stop());
