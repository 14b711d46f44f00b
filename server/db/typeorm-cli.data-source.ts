import { loadConfig } from '../config/env.js';
import { createDataSource } from './data-source.js';

/**
 * The DataSource TypeORM's own CLI loads (`npm run migration:generate -- server/db/migrations/<Name>`):
 * DATABASE_URL, or the local cluster's database. Generated migrations are reviewed and rewritten
 * as plain SQL before they are merged (DEVELOPERS.md).
 */
export default createDataSource(loadConfig().databaseUrl);
