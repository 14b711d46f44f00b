import type { QueryRunner, MigrationInterface } from 'typeorm';

/**
 * Kept records never go by cascade: a permit's reporting periods and limits, and a shipment's
 * signed copies, now block the delete of what they belong to (ON DELETE RESTRICT) instead of
 * vanishing with it. The services answer 409 with what to do instead.
 */
export class KeptRecordsRestrict1796227200000 implements MigrationInterface {
  name = 'KeptRecordsRestrict1796227200000';

  private readonly keys = [
    { table: 'reporting_period', name: 'reporting_period_permit_id_fkey', column: 'permit_id', references: 'permit' },
    { table: 'permit_limit', name: 'permit_limit_permit_id_fkey', column: 'permit_id', references: 'permit' },
    { table: 'shipment_file', name: 'shipment_file_shipment_id_fkey', column: 'shipment_id', references: 'shipment' },
  ];

  async up(q: QueryRunner): Promise<void> {
    for (const key of this.keys) await this.rebuild(q, key, 'RESTRICT');
  }

  async down(q: QueryRunner): Promise<void> {
    for (const key of this.keys) await this.rebuild(q, key, 'CASCADE');
  }

  private async rebuild(q: QueryRunner, key: (typeof this.keys)[number], action: 'RESTRICT' | 'CASCADE'): Promise<void> {
    await q.query(`ALTER TABLE ${key.table} DROP CONSTRAINT ${key.name}`);
    await q.query(
      `ALTER TABLE ${key.table} ADD CONSTRAINT ${key.name} FOREIGN KEY (${key.column}) REFERENCES ${key.references}(id) ON DELETE ${action}`,
    );
  }
}
