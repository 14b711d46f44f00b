import type { QueryRunner, MigrationInterface } from 'typeorm';

/** A follow-up closed by the record that resolved it (a signed copy, a check, a repeat sample) names that record. */
export class FollowUpsCloseThemselves1796270400000 implements MigrationInterface {
  name = 'FollowUpsCloseThemselves1796270400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE follow_up ADD COLUMN closed_by_entity varchar(40), ADD COLUMN closed_by_id uuid`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE follow_up DROP COLUMN closed_by_entity, DROP COLUMN closed_by_id`);
  }
}
