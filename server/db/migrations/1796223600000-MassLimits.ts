import type { QueryRunner, MigrationInterface } from 'typeorm';

/**
 * A permit may limit one parameter at one point both as a concentration (mg/L) and as a
 * loading (lb/day, kg/day) with the same statistic, so uniqueness now counts the basis too.
 * A limit may also say to how many decimal places its figures are reported.
 */
export class MassLimits1796223600000 implements MigrationInterface {
  name = 'MassLimits1796223600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`DO $$ DECLARE name text; BEGIN
      SELECT conname INTO name FROM pg_constraint WHERE conrelid = 'permit_limit'::regclass AND contype = 'u';
      EXECUTE format('ALTER TABLE permit_limit DROP CONSTRAINT %I', name);
    END $$`);
    await q.query('ALTER TABLE permit_limit ADD COLUMN reported_decimals smallint CHECK (reported_decimals BETWEEN 0 AND 6)');
    await q.query(`CREATE UNIQUE INDEX "UQ_permit_limit_basis" ON permit_limit
      (permit_id, discharge_point_id, parameter_id, statistic, (unit IN ('lb/day', 'kg/day')))`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP INDEX "UQ_permit_limit_basis"');
    await q.query('ALTER TABLE permit_limit DROP COLUMN reported_decimals');
    await q.query('ALTER TABLE permit_limit ADD UNIQUE (permit_id, discharge_point_id, parameter_id, statistic)');
  }
}
