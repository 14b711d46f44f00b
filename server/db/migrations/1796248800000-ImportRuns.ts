import type { QueryRunner, MigrationInterface } from 'typeorm';

/**
 * An import is a job of its own: its run (reading, checking, writing, done or failed), how far
 * it has gone and when it started are kept apart from the import's transaction, so any app
 * instance can answer how it is doing while it runs, and a run cut off by its time limit or a
 * restart says so.
 */
export class ImportRuns1796248800000 implements MigrationInterface {
  name = 'ImportRuns1796248800000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE import_run (
      id uuid PRIMARY KEY,
      site_id uuid NOT NULL CONSTRAINT import_run_site_id_fkey REFERENCES site(id) ON DELETE RESTRICT,
      user_id uuid NOT NULL CONSTRAINT import_run_user_id_fkey REFERENCES app_user(id),
      kind varchar(40) NOT NULL,
      file_name varchar(255) NOT NULL,
      status varchar(10) NOT NULL DEFAULT 'reading'
        CONSTRAINT import_run_status_check CHECK ((status)::text = ANY ((ARRAY['reading'::character varying, 'checking'::character varying, 'writing'::character varying, 'done'::character varying, 'failed'::character varying])::text[])),
      rows_total integer NOT NULL DEFAULT 0,
      rows_done integer NOT NULL DEFAULT 0,
      message text,
      started_at timestamptz NOT NULL DEFAULT now(),
      finished_at timestamptz
    )`);
    await q.query(`CREATE INDEX "IDX_import_run_user_started" ON import_run (user_id, started_at DESC)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE import_run`);
  }
}
