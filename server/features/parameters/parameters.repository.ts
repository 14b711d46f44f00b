import type { DataSource } from 'typeorm';
import type { Parameter } from '../../contracts/setup.js';
import { camelRow, type Row } from '../../db/rows.js';

export type ParameterView = Parameter & { siteId: string | null };

/** How a parameter row is written and shown (for the traced writes). */
export const parameterTarget = {
  table: 'parameter',
  entity: 'parameter',
  view: (row: Row): ParameterView => ({
    id: row.id as string,
    siteId: (row.siteId as string | null) ?? null,
    code: row.code as string,
    name: row.name as string,
    fraction: (row.fraction as 'HEM' | 'SGT-HEM' | null) ?? null,
    defaultUnit: row.defaultUnit as string,
    sncReviewFactor: row.sncReviewFactor === null ? null : Number(row.sncReviewFactor),
  }),
  siteIdOf: (row: Row) => (row.siteId as string | null) ?? null,
};

/** The shared catalogue plus the sites' own entries, narrowed to one site when asked. */
export async function findParameters(dataSource: DataSource, siteIds: string[], onlySiteId: string | null): Promise<ParameterView[]> {
  const rows: Row[] = await dataSource.query(
    `SELECT * FROM parameter WHERE (site_id IS NULL OR site_id = ANY($1::uuid[])) AND ($2::uuid IS NULL OR site_id IS NULL OR site_id = $2)
      ORDER BY site_id NULLS FIRST, name`,
    [siteIds, onlySiteId],
  );
  return rows.map((row) => parameterTarget.view(camelRow(row)));
}
