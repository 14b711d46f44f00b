import { DataSource, type EntityManager } from 'typeorm';
import type { PostgresDriver } from 'typeorm/driver/postgres/PostgresDriver.js';

interface ArrayQueryable {
  query(config: { text: string; values: unknown[]; rowMode: 'array' }): Promise<{ rows: unknown[][] }>;
}

/**
 * Rows as arrays instead of objects, for the few reads that bring back tens of thousands of
 * rows (a period's results): node-postgres then builds no object per row. Runs on the
 * caller's transaction when there is one.
 */
export async function queryArrays(db: DataSource | EntityManager, sql: string, params: unknown[]): Promise<unknown[][]> {
  const runner = db instanceof DataSource ? undefined : db.queryRunner;
  const client: ArrayQueryable =
    runner && !runner.isReleased
      ? await runner.connect()
      : ((db instanceof DataSource ? db : db.connection).driver as PostgresDriver).master;
  const { rows } = await client.query({ text: sql, values: params, rowMode: 'array' });
  return rows;
}
