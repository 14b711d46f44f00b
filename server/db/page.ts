import type { DataSource, EntityManager } from 'typeorm';
import type { Page } from '../contracts/paging.js';
import { inParallel } from './in-parallel.js';

export interface PageSpec {
  /** `SELECT … FROM …`: the columns of a row and the tables they come from. */
  select: string;
  /** `FROM …` to count over: the same filter, often with fewer joins. */
  countFrom: string;
  /** One filter for both, with `$1…$n` bound to `params`. */
  where: string;
  order: string;
  params: unknown[];
}

/** One page of rows and the count of every row the filter matches, read at once. */
export async function queryPage<Row, T>(
  db: DataSource | EntityManager,
  spec: PageSpec,
  page: { page: number; pageSize: number },
  view: (row: Row) => T,
): Promise<Page<T>> {
  const n = spec.params.length;
  const [rows, [{ count }]] = await inParallel(
    db,
    () =>
      db.query(`${spec.select} WHERE ${spec.where} ORDER BY ${spec.order} LIMIT $${n + 1} OFFSET $${n + 2}`, [
        ...spec.params,
        page.pageSize,
        (page.page - 1) * page.pageSize,
      ]) as Promise<Row[]>,
    () => db.query(`SELECT count(*)::int AS count ${spec.countFrom} WHERE ${spec.where}`, spec.params) as Promise<[{ count: number }]>,
  );
  return { items: rows.map(view), total: count, page: page.page, pageSize: page.pageSize };
}
