import { localDatabaseUrl } from '../config/env.js';
import { startLocalCluster, ensureDatabase, type LocalCluster } from './postgres.js';

export interface LocalDatabase {
  url: string;
  cluster: LocalCluster | null;
}

/**
 * DATABASE_URL when given (an existing PostgreSQL); otherwise the project's own cluster on
 * 127.0.0.1, installed and started as needed, with the named database created.
 */
export async function localDatabase(projectDir: string, database: string): Promise<LocalDatabase> {
  if (process.env.DATABASE_URL) return { url: process.env.DATABASE_URL, cluster: null };
  const port = Number(process.env.PGPORT ?? 54329);
  const cluster = await startLocalCluster(projectDir, port);
  await ensureDatabase(port, database);
  return { url: localDatabaseUrl(port, database), cluster };
}
