import type { QueryRunner, MigrationInterface } from 'typeorm';

const settingsColumns = `non_detect_policy, mass_loading_factor, daily_max_applies_to_each_grab, snc_window, late_report_days, monitoring_counts`;

/**
 * The permit settings that change results (non-detect policy, mass-loading factor, daily
 * maximum applied to each grab, six-month window, late-report days, what a monitoring frequency
 * counts) become versions, like limits: each applies from a day through an end day, and a
 * period uses the version in force on its first day. Existing permits get one version from
 * their start. A version a signed period used cannot change (SQLSTATE DL409) until the period is
 * amended; the lock on the permit row's own columns (PeriodSignOff) goes with them.
 */
export class PermitSettingsVersions1796245200000 implements MigrationInterface {
  name = 'PermitSettingsVersions1796245200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE permit_settings (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      permit_id uuid NOT NULL CONSTRAINT permit_settings_permit_id_fkey REFERENCES permit(id) ON DELETE RESTRICT,
      applies_from date NOT NULL,
      applies_to date,
      non_detect_policy varchar(10) NOT NULL
        CONSTRAINT permit_settings_non_detect_policy_check CHECK ((non_detect_policy)::text = ANY ((ARRAY['zero'::character varying, 'mdl'::character varying, 'ml'::character varying, 'half-mdl'::character varying])::text[])),
      mass_loading_factor numeric(6,4) NOT NULL
        CONSTRAINT permit_settings_mass_loading_factor_check CHECK (mass_loading_factor = ANY (ARRAY[8.34, 8.3454])),
      daily_max_applies_to_each_grab boolean NOT NULL DEFAULT false,
      snc_window varchar(16) NOT NULL
        CONSTRAINT permit_settings_snc_window_check CHECK ((snc_window)::text = ANY ((ARRAY['calendar-halves'::character varying, 'rolling'::character varying])::text[])),
      late_report_days smallint NOT NULL DEFAULT 45
        CONSTRAINT permit_settings_late_report_days_check CHECK ((late_report_days >= 1) AND (late_report_days <= 365)),
      monitoring_counts varchar(14) NOT NULL DEFAULT 'sampling-days'
        CONSTRAINT permit_settings_monitoring_counts_check CHECK ((monitoring_counts)::text = ANY ((ARRAY['sampling-days'::character varying, 'samples'::character varying])::text[])),
      created_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT permit_settings_applies_check CHECK ((applies_to IS NULL) OR (applies_to >= applies_from)),
      CONSTRAINT "EX_permit_settings_versions" EXCLUDE USING gist (permit_id WITH =, daterange(applies_from, applies_to, '[]') WITH &&)
    )`);
    await q.query(`INSERT INTO permit_settings (permit_id, applies_from, ${settingsColumns})
      SELECT id, effective_from, ${settingsColumns} FROM permit`);

    // The version a period uses: the one in force on its first day (or, for a period starting
    // before the permit's first version, that first version).
    await q.query(`CREATE FUNCTION permit_settings_on(p_permit uuid, p_day date) RETURNS permit_settings
      LANGUAGE sql STABLE AS $$
        SELECT * FROM permit_settings WHERE permit_id = p_permit
         ORDER BY (applies_from <= p_day) DESC, CASE WHEN applies_from <= p_day THEN applies_from END DESC, applies_from
         LIMIT 1
      $$`);

    await q.query(`DROP TRIGGER permit_settings_period_lock ON permit`);
    await q.query(`DROP FUNCTION permit_settings_period_lock()`);
    await q.query(`ALTER TABLE permit DROP COLUMN non_detect_policy, DROP COLUMN mass_loading_factor, DROP COLUMN daily_max_applies_to_each_grab,
      DROP COLUMN snc_window, DROP COLUMN late_report_days, DROP COLUMN monitoring_counts`);

    await q.query(`CREATE FUNCTION permit_settings_period_lock() RETURNS trigger LANGUAGE plpgsql SECURITY DEFINER SET search_path = public AS $$
      DECLARE locked record; used permit_settings; permitted boolean;
      BEGIN
        FOR locked IN
          SELECT rp.starts_on, rp.ends_on, rp.revision, p.number
            FROM reporting_period rp JOIN permit p ON p.id = rp.permit_id
           WHERE rp.status = 'signed' AND rp.permit_id = CASE WHEN TG_OP = 'INSERT' THEN NEW.permit_id ELSE OLD.permit_id END
        LOOP
          used := permit_settings_on(CASE WHEN TG_OP = 'INSERT' THEN NEW.permit_id ELSE OLD.permit_id END, locked.starts_on);
          permitted := true;
          IF TG_OP = 'INSERT' THEN
            permitted := NOT (locked.starts_on <@ daterange(NEW.applies_from, NEW.applies_to, '[]'));
          ELSIF used.id = OLD.id THEN
            permitted := TG_OP = 'UPDATE'
              AND (to_jsonb(NEW) - 'applies_to') = (to_jsonb(OLD) - 'applies_to')
              AND locked.starts_on <@ daterange(NEW.applies_from, NEW.applies_to, '[]');
          END IF;
          IF NOT permitted THEN
            RAISE EXCEPTION 'The period % – % of permit % is signed (revision %) and was computed with these settings',
              locked.starts_on, locked.ends_on, locked.number, locked.revision
              USING ERRCODE = 'DL409', HINT = 'Give the new settings a start after that period, or open an amendment on it';
          END IF;
        END LOOP;
        RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
      END $$`);
    await q.query(`CREATE TRIGGER permit_settings_period_lock BEFORE INSERT OR UPDATE OR DELETE ON permit_settings
      FOR EACH ROW EXECUTE FUNCTION permit_settings_period_lock()`);
    await q.query(`CREATE TRIGGER permit_settings_outside_decant AFTER INSERT OR UPDATE OR DELETE ON permit_settings
      FOR EACH ROW EXECUTE FUNCTION record_change_outside_decant()`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TRIGGER permit_settings_outside_decant ON permit_settings`);
    await q.query(`DROP TRIGGER permit_settings_period_lock ON permit_settings`);
    await q.query(`DROP FUNCTION permit_settings_period_lock()`);
    await q.query(`ALTER TABLE permit ADD COLUMN non_detect_policy varchar(10), ADD COLUMN mass_loading_factor numeric(6,4),
      ADD COLUMN daily_max_applies_to_each_grab boolean NOT NULL DEFAULT false, ADD COLUMN snc_window varchar(16),
      ADD COLUMN late_report_days smallint NOT NULL DEFAULT 45, ADD COLUMN monitoring_counts varchar(14) NOT NULL DEFAULT 'sampling-days'`);
    await q.query(`UPDATE permit p SET (${settingsColumns}) = (SELECT ${settingsColumns} FROM permit_settings_on(p.id, current_date))`);
    await q.query(`ALTER TABLE permit ALTER COLUMN non_detect_policy SET NOT NULL, ALTER COLUMN mass_loading_factor SET NOT NULL,
      ALTER COLUMN snc_window SET NOT NULL`);
    await q.query(`DROP FUNCTION permit_settings_on(uuid, date)`);
    await q.query(`DROP TABLE permit_settings`);
  }
}
