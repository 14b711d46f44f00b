import 'reflect-metadata';
import pg from 'pg';
import { DataSource } from 'typeorm';
import { entities } from './entities.js';
import { migrations } from './migrations/index.js';

// A DATE is a calendar day of a site, not an instant: keep it as 'YYYY-MM-DD' text.
pg.types.setTypeParser(pg.types.builtins.DATE, (value) => value);

/**
 * One DataSource factory for the app, the CLI and the tests; the schema changes only through
 * migrations. `asApp` marks the connections as Decant's own (`decant.via_app`), whose changes
 * carry their trail entries; a change to a regulated table from any other connection is
 * written to the trail as made outside Decant by the database's triggers.
 */
export function createDataSource(url: string, { asApp = false }: { asApp?: boolean } = {}): DataSource {
  return new DataSource({
    type: 'postgres',
    url,
    entities,
    migrations,
    synchronize: false,
    migrationsRun: false,
    logging: false,
    // Decant's storage is SSD-class: at the default random_page_cost (4, tuned for spinning
    // disks) the planner scans every result instead of probing the index for a period's rows.
    extra: { max: 10, application_name: 'decant', options: `-c random_page_cost=1.1${asApp ? ' -c decant.via_app=on' : ''}` },
  });
}
