import type { QueryRunner, MigrationInterface } from 'typeorm';

/** A reminder whose follow-up closed before it went out is dropped, not sent: it would be wrong by then. */
export class MailDropped1796277600000 implements MigrationInterface {
  name = 'MailDropped1796277600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE mail_outbox DROP CONSTRAINT mail_outbox_status_check`);
    await q.query(
      `ALTER TABLE mail_outbox ADD CONSTRAINT mail_outbox_status_check CHECK (status IN ('pending', 'sent', 'failed', 'dropped'))`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE mail_outbox DROP CONSTRAINT mail_outbox_status_check`);
    await q.query(`ALTER TABLE mail_outbox ADD CONSTRAINT mail_outbox_status_check CHECK (status IN ('pending', 'sent', 'failed'))`);
  }
}
