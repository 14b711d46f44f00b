import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { entities } from './entities.js';
import { migrations } from './migrations/index.js';

/** One DataSource factory for the app, the CLI and the tests; the schema changes only through migrations. */
export function createDataSource(url: string): DataSource {
  return new DataSource({
    type: 'postgres',
    url,
    entities,
    migrations,
    synchronize: false,
    migrationsRun: false,
    logging: false,
    extra: { max: 10, application_name: 'decant' },
  });
}
