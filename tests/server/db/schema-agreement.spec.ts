import { Column, DataSource, Entity, PrimaryGeneratedColumn } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDataSource } from '../../../server/db/data-source.js';
import { entities } from '../../../server/db/entities.js';
import { testDatabaseUrl } from '../../helpers/test-env.js';

/** What `migration:generate` would write: TypeORM's schema builder compares entities with the live schema. */
async function pendingSchemaChanges(dataSource: DataSource): Promise<string[]> {
  const log = await dataSource.driver.createSchemaBuilder().log();
  return log.upQueries.map((query) => query.query);
}

describe('entities and the migrated schema', () => {
  let dataSource: DataSource;
  beforeAll(async () => {
    dataSource = await createDataSource(testDatabaseUrl).initialize();
  });
  afterAll(() => dataSource.destroy());

  it('agree: on the freshly migrated database TypeORM finds nothing to change', async () => {
    expect(await pendingSchemaChanges(dataSource)).toEqual([]);
  });

  it('cover every table the migrations create', async () => {
    const tables: Array<{ table_name: string }> = await dataSource.query(
      `SELECT table_name FROM information_schema.tables
        WHERE table_schema = 'public' AND table_type = 'BASE TABLE' AND table_name <> 'migrations'`,
    );
    const mapped = new Set(dataSource.entityMetadatas.map((metadata) => metadata.tableName));
    expect(tables.map((row) => row.table_name).filter((table) => !mapped.has(table))).toEqual([]);
  });

  it('would be caught disagreeing: an entity the schema lacks shows up as a change', async () => {
    @Entity('schema_agreement_probe')
    class SchemaAgreementProbe {
      @PrimaryGeneratedColumn('uuid')
      id: string;

      @Column({ type: 'varchar', length: 10 })
      label: string;
    }
    const probe = new DataSource({ type: 'postgres', url: testDatabaseUrl, entities: [...entities, SchemaAgreementProbe] });
    await probe.initialize();
    try {
      expect((await pendingSchemaChanges(probe)).join('\n')).toContain('CREATE TABLE "schema_agreement_probe"');
    } finally {
      await probe.destroy();
    }
  });
});
