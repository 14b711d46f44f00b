import type { MigrationInterface, QueryRunner } from 'typeorm';

/** When each periodic report was sent, and the file that closed a follow-up. */
export class ReportSubmissions1796220000000 implements MigrationInterface {
  name = 'ReportSubmissions1796220000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE reporting_period ADD COLUMN submitted_on date');
    await q.query('ALTER TABLE follow_up ADD COLUMN closing_file_id uuid REFERENCES stored_file(id)');
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE follow_up DROP COLUMN closing_file_id');
    await q.query('ALTER TABLE reporting_period DROP COLUMN submitted_on');
  }
}
