import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Companies, sites, users with their roles and sites, sessions, and the append-only trail. */
export class Foundation1796205600000 implements MigrationInterface {
  name = 'Foundation1796205600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE company (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      name varchar(200) NOT NULL UNIQUE,
      created_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE TABLE site (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      company_id uuid NOT NULL REFERENCES company(id) ON DELETE RESTRICT,
      name varchar(200) NOT NULL,
      address text NOT NULL DEFAULT '',
      time_zone varchar(64) NOT NULL,
      retention_years smallint NOT NULL DEFAULT 5 CHECK (retention_years >= 3),
      generator_status varchar(16) NOT NULL DEFAULT 'small' CHECK (generator_status IN ('large', 'small', 'very-small')),
      manifest_rule varchar(16) NOT NULL DEFAULT 'current' CHECK (manifest_rule IN ('current', 'before-2025')),
      oil_storage_capacity_gallons numeric(12,2) CHECK (oil_storage_capacity_gallons >= 0),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (company_id, name)
    )`);
    await q.query(`CREATE TABLE app_user (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      email varchar(254) NOT NULL UNIQUE CHECK (email = lower(email)),
      name varchar(120) NOT NULL,
      subject varchar(512) UNIQUE,
      role varchar(20) CHECK (role IN ('administrator', 'coordinator', 'operator', 'auditor')),
      active boolean NOT NULL DEFAULT true,
      last_sign_in_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE TABLE user_site (
      user_id uuid NOT NULL REFERENCES app_user(id) ON DELETE CASCADE,
      site_id uuid NOT NULL REFERENCES site(id) ON DELETE CASCADE,
      PRIMARY KEY (user_id, site_id)
    )`);
    await q.query(`CREATE INDEX "IDX_user_site_site" ON user_site (site_id)`);

    // connect-pg-simple's table, created here so the app never alters the schema at run time.
    await q.query(`CREATE TABLE session (
      sid varchar NOT NULL PRIMARY KEY,
      sess json NOT NULL,
      expire timestamp(6) NOT NULL
    )`);
    await q.query(`CREATE INDEX "IDX_session_expire" ON session (expire)`);

    await q.query(`CREATE TABLE trail_entry (
      id bigserial PRIMARY KEY,
      occurred_at timestamptz NOT NULL DEFAULT now(),
      actor_id uuid,
      actor_email varchar(254),
      action varchar(40) NOT NULL,
      entity varchar(60) NOT NULL,
      entity_id varchar(64) NOT NULL,
      site_id uuid,
      before jsonb,
      after jsonb
    )`);
    await q.query(`CREATE INDEX "IDX_trail_entry_entity" ON trail_entry (entity, entity_id)`);
    await q.query(`CREATE INDEX "IDX_trail_entry_site_time" ON trail_entry (site_id, occurred_at DESC)`);
    await q.query(`CREATE FUNCTION trail_entry_is_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        RAISE EXCEPTION 'trail_entry is append-only: % refused', TG_OP USING ERRCODE = 'insufficient_privilege';
      END $$`);
    await q.query(`CREATE TRIGGER trail_entry_no_update_or_delete BEFORE UPDATE OR DELETE ON trail_entry
      FOR EACH ROW EXECUTE FUNCTION trail_entry_is_append_only()`);
    await q.query(`CREATE TRIGGER trail_entry_no_truncate BEFORE TRUNCATE ON trail_entry
      FOR EACH STATEMENT EXECUTE FUNCTION trail_entry_is_append_only()`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE trail_entry`);
    await q.query(`DROP FUNCTION trail_entry_is_append_only()`);
    await q.query(`DROP TABLE session`);
    await q.query(`DROP TABLE user_site`);
    await q.query(`DROP TABLE app_user`);
    await q.query(`DROP TABLE site`);
    await q.query(`DROP TABLE company`);
  }
}
