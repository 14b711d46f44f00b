// Plain JavaScript on purpose: it runs before node_modules exists, so it cannot use tsx.
// Installs the locked npm packages when they are missing or older than the lock file.
import { execSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';

const marker = 'node_modules/.package-lock.json';
const stale = !existsSync(marker) || statSync(marker).mtimeMs < statSync('package-lock.json').mtimeMs;
if (stale) {
  console.log('Installing npm packages (npm ci)…');
  execSync('npm ci --no-audit --no-fund', { stdio: 'inherit' });
}
