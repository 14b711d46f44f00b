import type { QueryRunner, MigrationInterface } from 'typeorm';

/**
 * The notice a coordinator sends the control authority about a violation: drafted from the facts
 * the violation's follow-up keeps, edited, then sent once and kept as sent (with its PDF).
 */
export class AuthorityNotices1796274000000 implements MigrationInterface {
  name = 'AuthorityNotices1796274000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE follow_up ADD COLUMN facts jsonb`);
    await q.query(`CREATE TABLE authority_notice (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      follow_up_id uuid NOT NULL UNIQUE REFERENCES follow_up(id) ON DELETE RESTRICT,
      site_id uuid NOT NULL REFERENCES site(id) ON DELETE RESTRICT,
      cause text NOT NULL DEFAULT '',
      corrective_action text NOT NULL DEFAULT '',
      repeat_sample_on date,
      status varchar(10) NOT NULL DEFAULT 'draft' CHECK (status IN ('draft', 'sent')),
      to_address varchar(254),
      file_id uuid REFERENCES stored_file(id) ON DELETE RESTRICT,
      created_by uuid NOT NULL REFERENCES app_user(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      sent_at timestamptz,
      sent_by uuid REFERENCES app_user(id),
      CHECK (status = 'draft' OR (sent_at IS NOT NULL AND to_address IS NOT NULL AND file_id IS NOT NULL))
    )`);
    // A sent notice is what the authority received: it is never changed afterwards.
    await q.query(`CREATE FUNCTION authority_notice_sent_is_final() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF OLD.status = 'sent' THEN RAISE EXCEPTION 'A sent notice is kept as sent' USING ERRCODE = 'P0001'; END IF;
        RETURN NEW;
      END $$`);
    await q.query(`CREATE TRIGGER authority_notice_sent_is_final BEFORE UPDATE OR DELETE ON authority_notice
      FOR EACH ROW EXECUTE FUNCTION authority_notice_sent_is_final()`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE authority_notice');
    await q.query('DROP FUNCTION authority_notice_sent_is_final()');
    await q.query('ALTER TABLE follow_up DROP COLUMN facts');
  }
}
