import { Brackets, type DataSource } from 'typeorm';
import type { Parameter as ParameterContract } from '../../contracts/setup.js';
import type { Target } from '../../kernel/trail/traced-writes.js';
import { Parameter } from './parameter.entity.js';

export type ParameterView = ParameterContract & { siteId: string | null };

/** How a parameter is written and shown (for the traced writes). */
export const parameterTarget = {
  entityClass: Parameter,
  entity: 'parameter',
  view: (row: Parameter): ParameterView => ({
    id: row.id,
    siteId: row.siteId,
    code: row.code,
    name: row.name,
    fraction: row.fraction,
    defaultUnit: row.defaultUnit,
    sncReviewFactor: row.sncReviewFactor === null ? null : Number(row.sncReviewFactor),
  }),
  siteIdOf: (row: Parameter) => row.siteId,
} satisfies Target<Parameter, ParameterView>;

/** The shared catalogue plus the sites' own entries, narrowed to one site when asked. */
export async function findParameters(dataSource: DataSource, siteIds: string[], onlySiteId: string | null): Promise<ParameterView[]> {
  const query = dataSource.manager
    .createQueryBuilder(Parameter, 'parameter')
    .where(new Brackets((where) => where.where('parameter.siteId IS NULL').orWhere('parameter.siteId = ANY(:siteIds)', { siteIds })))
    .orderBy('parameter.siteId', 'ASC', 'NULLS FIRST')
    .addOrderBy('parameter.name', 'ASC');
  if (onlySiteId) query.andWhere('(parameter.siteId IS NULL OR parameter.siteId = :onlySiteId)', { onlySiteId });
  return (await query.getMany()).map(parameterTarget.view);
}
