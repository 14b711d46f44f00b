import { localAppDatabaseUrl, localAppRole, localDatabaseUrl } from '../config/env.js';
import { ensureAppRole, ensureDatabase, startLocalCluster, type LocalCluster } from './postgres.js';

export interface LocalDatabase {
  /** The owner's connection (migrations, seed). */
  url: string;
  /** The app's least-privileged connection. */
  appUrl: string;
  cluster: LocalCluster | null;
}

/**
 * DATABASE_URL when given (an existing PostgreSQL); otherwise the project's own cluster on
 * 127.0.0.1, installed and started as needed, with the named database created.
 */
export async function localDatabase(projectDir: string, database: string): Promise<LocalDatabase> {
  if (process.env.DATABASE_URL) {
    return { url: process.env.DATABASE_URL, appUrl: process.env.APP_DATABASE_URL ?? process.env.DATABASE_URL, cluster: null };
  }
  const port = Number(process.env.PGPORT ?? 54329);
  const cluster = await startLocalCluster(projectDir, port);
  await ensureDatabase(port, database);
  await ensureAppRole(port, localAppRole.name, localAppRole.password);
  return { url: localDatabaseUrl(port, database), appUrl: localAppDatabaseUrl(port, database), cluster };
}
