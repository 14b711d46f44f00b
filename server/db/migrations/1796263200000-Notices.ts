import PgBoss from 'pg-boss';
import type { QueryRunner, MigrationInterface } from 'typeorm';

/**
 * Notices by mail. The job queue (pg-boss) gets its schema here, in the same database, created
 * by the owner: the app's role may use it, not alter it. Mail is an outbox: a row per event and
 * recipient, written in the transaction that causes it with what the mail must say (`params`), then
 * written out and delivered by a job; the unique key makes one mail per event per recipient
 * however many instances deliver.
 */
export class Notices1796263200000 implements MigrationInterface {
  name = 'Notices1796263200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(PgBoss.getConstructionPlans('pgboss'));
    await q.query(`CREATE TABLE mail_outbox (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      event_key varchar(200) NOT NULL,
      kind varchar(30) NOT NULL,
      user_id uuid REFERENCES app_user(id) ON DELETE RESTRICT,
      recipient varchar(320) NOT NULL,
      params jsonb NOT NULL DEFAULT '{}',
      subject varchar(300),
      follow_up_id uuid REFERENCES follow_up(id) ON DELETE RESTRICT,
      status varchar(10) NOT NULL DEFAULT 'pending' CHECK (status IN ('pending', 'sent', 'failed')),
      attempts integer NOT NULL DEFAULT 0,
      next_attempt_at timestamptz NOT NULL DEFAULT now(),
      last_error text,
      sent_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (event_key, recipient)
    )`);
    await q.query(`CREATE INDEX "IDX_mail_outbox_pending" ON mail_outbox (next_attempt_at) WHERE status = 'pending'`);
    await q.query(`CREATE INDEX "IDX_mail_outbox_follow_up" ON mail_outbox (follow_up_id) WHERE follow_up_id IS NOT NULL`);
    // A committed mail wakes the delivery job at once; the minute schedule catches anything missed.
    await q.query(`CREATE FUNCTION mail_outbox_notify() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN PERFORM pg_notify('decant_mail', ''); RETURN NULL; END $$`);
    await q.query(`CREATE TRIGGER mail_outbox_notify AFTER INSERT ON mail_outbox FOR EACH STATEMENT EXECUTE FUNCTION mail_outbox_notify()`);
    await q.query(`CREATE TABLE mail_preference (
      user_id uuid NOT NULL REFERENCES app_user(id) ON DELETE CASCADE,
      kind varchar(30) NOT NULL,
      delivery varchar(10) NOT NULL CHECK (delivery IN ('now', 'digest', 'off')),
      updated_at timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (user_id, kind)
    )`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE mail_preference');
    await q.query('DROP TABLE mail_outbox');
    await q.query('DROP FUNCTION mail_outbox_notify()');
    await q.query('DROP SCHEMA pgboss CASCADE');
  }
}
