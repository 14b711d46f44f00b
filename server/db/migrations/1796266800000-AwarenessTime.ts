import type { QueryRunner, MigrationInterface } from 'typeorm';

/**
 * When the site became aware of a violation: the time of day a certificate was received (its day
 * was already kept), and on each follow-up the moment its clock starts from and where that came
 * from, which a coordinator may correct with a reason.
 */
export class AwarenessTime1796266800000 implements MigrationInterface {
  name = 'AwarenessTime1796266800000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE lab_certificate ADD COLUMN received_time time(0)`);
    await q.query(`ALTER TABLE follow_up ADD COLUMN aware_at timestamptz, ADD COLUMN aware_source varchar(300)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE follow_up DROP COLUMN aware_at, DROP COLUMN aware_source`);
    await q.query(`ALTER TABLE lab_certificate DROP COLUMN received_time`);
  }
}
