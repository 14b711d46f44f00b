import type { Row } from '../../db/rows.js';

const numberOrNull = (value: unknown) => (value === null || value === undefined ? null : Number(value));

export const siteTarget = {
  table: 'site',
  entity: 'site',
  view: (row: Row) => ({
    id: row.id as string,
    name: row.name as string,
    address: row.address as string,
    timeZone: row.timeZone as string,
    retentionYears: Number(row.retentionYears),
    generatorStatus: row.generatorStatus as string,
    manifestRule: row.manifestRule as string,
    oilStorageCapacityGallons: numberOrNull(row.oilStorageCapacityGallons),
  }),
  siteIdOf: (row: Row) => row.id as string,
};
