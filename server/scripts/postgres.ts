import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { chownSync, existsSync, mkdirSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { connect } from 'node:net';
import { join, resolve } from 'node:path';
import pg from 'pg';
import { run, runStatus } from './processes.js';

/**
 * The local PostgreSQL that `npm start` and `npm test` use: Debian's packages, a cluster in an
 * ignored project folder, listening on 127.0.0.1 only and with no Unix socket.
 */
const isRoot = process.getuid?.() === 0;
const asPostgres = (command: string, args: string[]) =>
  isRoot ? (['runuser', ['-u', 'postgres', '--', command, ...args]] as const) : ([command, args] as const);

function findBinaries(): string | null {
  const root = '/usr/lib/postgresql';
  if (!existsSync(root)) return null;
  const versions = readdirSync(root)
    .filter((name) => existsSync(join(root, name, 'bin', 'pg_ctl')))
    .sort((a, b) => Number(b) - Number(a));
  return versions[0] ? join(root, versions[0], 'bin') : null;
}

export function ensurePostgresInstalled(): string {
  const found = findBinaries();
  if (found) return found;
  if (!isRoot) throw new Error('PostgreSQL is not installed. Run: sudo apt-get install -y postgresql');
  console.log("Installing Debian's postgresql package…");
  run('apt-get', ['update', '-qq']);
  run('apt-get', ['install', '-y', '-qq', 'postgresql'], { env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
  const installed = findBinaries();
  if (!installed) throw new Error('PostgreSQL binaries not found after installing postgresql');
  return installed;
}

/** The postgres OS user must be able to reach the data folder; a private temp clone may not allow that. */
function clusterFolder(projectDir: string): string {
  const local = resolve(projectDir, '.data/postgres');
  mkdirSync(resolve(projectDir, '.data'), { recursive: true });
  if (!isRoot || runStatus('runuser', ['-u', 'postgres', '--', 'test', '-x', resolve(projectDir, '.data')]) === 0) {
    return local;
  }
  const hash = createHash('sha256').update(projectDir).digest('hex').slice(0, 12);
  const fallback = `/var/tmp/decant-postgres-${hash}`;
  console.log(`The postgres user cannot reach ${local}; keeping the cluster in ${fallback}`);
  return fallback;
}

export interface LocalCluster {
  port: number;
  startedHere: boolean;
  stop(): void;
}

export async function startLocalCluster(projectDir: string, port: number): Promise<LocalCluster> {
  const bin = ensurePostgresInstalled();
  const dataDir = clusterFolder(projectDir);
  if (!existsSync(join(dataDir, 'PG_VERSION'))) {
    rmSync(dataDir, { recursive: true, force: true });
    mkdirSync(dataDir, { recursive: true, mode: 0o700 });
    const passwordFile = join(dataDir, '..', `.pgpass-init-${process.pid}`);
    writeFileSync(passwordFile, 'decant\n', { mode: 0o600 });
    if (isRoot) {
      const ids = postgresIds();
      chownSync(dataDir, ids.uid, ids.gid);
      chownSync(passwordFile, ids.uid, ids.gid);
    }
    try {
      const [command, args] = asPostgres(join(bin, 'initdb'), [
        '-D',
        dataDir,
        '-U',
        'decant',
        `--pwfile=${passwordFile}`,
        '-A',
        'scram-sha-256',
        '-E',
        'UTF8',
        '--locale=C.UTF-8',
      ]);
      run(command, [...args], { stdio: 'ignore' });
    } finally {
      rmSync(passwordFile, { force: true });
    }
  }
  const ctl = (args: string[]) => asPostgres(join(bin, 'pg_ctl'), ['-D', dataDir, ...args]);
  const [statusCommand, statusArgs] = ctl(['status']);
  const running = runStatus(statusCommand, [...statusArgs]) === 0;
  if (!running) {
    if (await portTaken(port)) {
      throw new Error(
        `Port ${port} on 127.0.0.1 is taken by another program (another checkout's database, perhaps). Stop it, or pick a free port: PGPORT=${port + 10} npm start`,
      );
    }
    const [command, args] = ctl([
      '-l',
      join(dataDir, 'server.log'),
      '-w',
      '-t',
      '60',
      '-o',
      `-c listen_addresses=127.0.0.1 -p ${port} -c unix_socket_directories=''`,
      'start',
    ]);
    run(command, [...args], { stdio: ['ignore', 'ignore', 'inherit'] });
  }
  return {
    port,
    startedHere: !running,
    stop() {
      const [command, args] = ctl(['-m', 'fast', '-w', 'stop']);
      runStatus(command, [...args]);
    },
  };
}

/** Whether something already listens on the port, so PostgreSQL's own "could not bind" is not all the user sees. */
function portTaken(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = connect({ host: '127.0.0.1', port });
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
  });
}

function postgresIds(): { uid: number; gid: number } {
  const uid = Number(execText('id', ['-u', 'postgres']));
  const gid = Number(execText('id', ['-g', 'postgres']));
  return { uid, gid };
}

function execText(command: string, args: string[]): string {
  return execFileSync(command, args, { encoding: 'utf8' }).trim();
}

/**
 * The role the app runs as on the local cluster: it logs in, and can do nothing else until
 * migrations grant it its privileges (server/db/app-role.ts).
 */
export async function ensureAppRole(port: number, role: string, password: string): Promise<void> {
  const client = new pg.Client({ host: '127.0.0.1', port, user: 'decant', password: 'decant', database: 'postgres' });
  await client.connect();
  try {
    const found = await client.query('SELECT 1 FROM pg_roles WHERE rolname = $1', [role]);
    if (found.rowCount === 0) {
      await client.query(
        `CREATE ROLE "${role.replace(/"/g, '')}" LOGIN NOSUPERUSER NOCREATEDB NOCREATEROLE NOREPLICATION PASSWORD '${password.replace(/'/g, "''")}'`,
      );
    }
  } finally {
    await client.end();
  }
}

/** Creates the database when missing, connecting as the cluster's owner. */
export async function ensureDatabase(port: number, database: string): Promise<void> {
  const client = new pg.Client({ host: '127.0.0.1', port, user: 'decant', password: 'decant', database: 'postgres' });
  await client.connect();
  try {
    const found = await client.query('SELECT 1 FROM pg_database WHERE datname = $1', [database]);
    if (found.rowCount === 0) await client.query(`CREATE DATABASE "${database.replace(/"/g, '')}"`);
  } finally {
    await client.end();
  }
}
