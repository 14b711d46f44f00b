import { DataSource, type EntityManager } from 'typeorm';

/**
 * Runs independent reads at once on the pool's connections; inside a transaction, where there
 * is one connection, one after the other (a connection answers one query at a time).
 */
export async function inParallel<A, B>(db: DataSource | EntityManager, first: () => Promise<A>, second: () => Promise<B>): Promise<[A, B]> {
  const shared = !(db instanceof DataSource) && db.queryRunner !== undefined;
  if (shared) return [await first(), await second()];
  return Promise.all([first(), second()]);
}
