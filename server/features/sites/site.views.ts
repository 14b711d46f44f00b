import type { Target } from '../../kernel/trail/traced-writes.js';
import { Site } from '../../kernel/sites/site.entity.js';

export const siteTarget = {
  entityClass: Site,
  entity: 'site',
  view: (row: Site) => ({
    id: row.id,
    name: row.name,
    address: row.address,
    timeZone: row.timeZone,
    retentionYears: Number(row.retentionYears),
    generatorStatus: row.generatorStatus,
    manifestRule: row.manifestRule,
    oilStorageCapacityGallons: row.oilStorageCapacityGallons,
  }),
  siteIdOf: (row: Site) => row.id,
} satisfies Target<Site, unknown>;
