import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { localDatabase } from './local-database.js';
import { run, runStatus } from './processes.js';

// `npm test`: the same set-up as `npm start` against the test database, then type checks and
// lint, and every Vitest project. Stops the database afterwards if it started it.
const projectDir = resolve(import.meta.dirname, '../..');
const bin = (name: string) => resolve(projectDir, 'node_modules/.bin', name);

function ensureChromium(): void {
  if (existsSync('/usr/bin/chromium')) return;
  if (process.getuid?.() !== 0) throw new Error("Browser tests need Debian's chromium: sudo apt-get install -y chromium");
  console.log("Installing Debian's chromium for the browser tests…");
  run('apt-get', ['update', '-qq']);
  run('apt-get', ['install', '-y', '-qq', 'chromium'], { env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
}

/** One plain closing line that any CI reads: "Tests: N passed, N failed, N skipped". */
function printSummaryLine(resultsFile: string): void {
  if (!existsSync(resultsFile)) return;
  const results = JSON.parse(readFileSync(resultsFile, 'utf8')) as {
    numPassedTests: number;
    numFailedTests: number;
    numPendingTests: number;
    numTodoTests: number;
  };
  const skipped = results.numPendingTests + results.numTodoTests;
  console.log(`\nTests: ${results.numPassedTests} passed, ${results.numFailedTests} failed, ${skipped} skipped`);
}

const database = await localDatabase(projectDir, 'decant_test');
let exitCode: number;
try {
  ensureChromium();
  // Caches of tsx and the browser stay inside the project.
  const tmp = resolve(projectDir, '.tmp');
  run('mkdir', ['-p', tmp]);
  const env = { ...process.env, DATABASE_URL: database.url, APP_DATABASE_URL: database.appUrl, NODE_ENV: 'test', TMPDIR: tmp };
  console.log('Type checking…');
  run('npm', ['run', '--silent', 'typecheck'], { env });
  // The shape of the code (import boundaries, HTTP-only routes) and its format fail the run too.
  console.log('Linting…');
  run('npm', ['run', '--silent', 'lint'], { env });
  console.log('Building the client for the browser tests…');
  run(bin('vite'), ['build', '--logLevel', 'warn'], { env });
  const resultsFile = resolve(tmp, 'vitest-results.json');
  exitCode = runStatus(
    bin('vitest'),
    ['run', '--reporter=default', '--reporter=json', `--outputFile.json=${resultsFile}`, ...process.argv.slice(2)],
    { env, stdio: 'inherit' },
  );
  printSummaryLine(resultsFile);
} finally {
  if (database.cluster?.startedHere) database.cluster.stop();
}
process.exit(exitCode);
