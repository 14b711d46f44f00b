import type { QueryRunner, MigrationInterface } from 'typeorm';

/**
 * The tools behind the numbers: each piece of equipment's application sheet (appended versions),
 * tank checks kept as dated records and attachable to a follow-up, and the discharge point a
 * piece of equipment serves, so a result there leads to it.
 */
export class EquipmentTools1796281200000 implements MigrationInterface {
  name = 'EquipmentTools1796281200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE equipment ADD COLUMN discharge_point_id uuid
      CONSTRAINT equipment_discharge_point_id_fkey REFERENCES discharge_point(id) ON DELETE RESTRICT`);
    await q.query(`CREATE TABLE application_sheet (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      equipment_id uuid NOT NULL CONSTRAINT application_sheet_equipment_id_fkey REFERENCES equipment(id) ON DELETE RESTRICT,
      site_id uuid NOT NULL CONSTRAINT application_sheet_site_id_fkey REFERENCES site(id) ON DELETE RESTRICT,
      version smallint NOT NULL,
      content jsonb NOT NULL,
      reason varchar(500) NOT NULL DEFAULT '',
      saved_by uuid NOT NULL CONSTRAINT application_sheet_saved_by_fkey REFERENCES app_user(id),
      saved_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT application_sheet_equipment_id_version_key UNIQUE (equipment_id, version))`);
    await q.query(`CREATE TABLE tank_check (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      site_id uuid NOT NULL CONSTRAINT tank_check_site_id_fkey REFERENCES site(id) ON DELETE RESTRICT,
      equipment_id uuid CONSTRAINT tank_check_equipment_id_fkey REFERENCES equipment(id) ON DELETE RESTRICT,
      follow_up_id uuid CONSTRAINT tank_check_follow_up_id_fkey REFERENCES follow_up(id) ON DELETE RESTRICT,
      input jsonb NOT NULL,
      result jsonb NOT NULL,
      verdict varchar(10) NOT NULL CONSTRAINT tank_check_verdict_check CHECK (verdict IN ('rises', 'too-short', 'oil-sinks')),
      checked_by uuid NOT NULL CONSTRAINT tank_check_checked_by_fkey REFERENCES app_user(id),
      created_at timestamptz NOT NULL DEFAULT now())`);
    await q.query(`CREATE INDEX "IDX_tank_check_equipment" ON tank_check (equipment_id, created_at)`);
    await q.query(`CREATE INDEX "IDX_tank_check_follow_up" ON tank_check (follow_up_id)`);
    // Kept records: a sheet is appended, a check is kept as run; only attaching a check once is an update.
    await q.query(`CREATE FUNCTION tank_check_attach_only() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF TG_OP = 'DELETE' OR OLD.follow_up_id IS NOT NULL
           OR (to_jsonb(NEW) - 'follow_up_id') IS DISTINCT FROM (to_jsonb(OLD) - 'follow_up_id') THEN
          RAISE EXCEPTION 'A tank check is kept as it was run; it can only be attached to a follow-up once';
        END IF;
        RETURN NEW;
      END $$`);
    await q.query(
      `CREATE TRIGGER tank_check_kept BEFORE UPDATE OR DELETE ON tank_check FOR EACH ROW EXECUTE FUNCTION tank_check_attach_only()`,
    );
    await q.query(`CREATE FUNCTION application_sheet_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        RAISE EXCEPTION 'An application sheet version is kept: save a new version instead';
      END $$`);
    await q.query(`CREATE TRIGGER application_sheet_kept BEFORE UPDATE OR DELETE ON application_sheet
      FOR EACH ROW EXECUTE FUNCTION application_sheet_append_only()`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE tank_check');
    await q.query('DROP FUNCTION tank_check_attach_only()');
    await q.query('DROP TABLE application_sheet');
    await q.query('DROP FUNCTION application_sheet_append_only()');
    await q.query('ALTER TABLE equipment DROP COLUMN discharge_point_id');
  }
}
