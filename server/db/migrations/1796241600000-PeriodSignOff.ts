import type { QueryRunner, MigrationInterface } from 'typeorm';

/** Tables whose rows carry a site's day directly or through a sample: what a signed period locks. */
const lockedByDay = ['lab_sample', 'lab_result', 'lab_certificate', 'qc_batch', 'flow_reading'] as const;

/**
 * History that does not move.
 *
 * - A limit is a series of versions, each applying from a day through an end day (open while
 *   in force); versions of one basis never overlap (exclusion constraint). Existing limits
 *   become versions that apply from their permit's start.
 * - A signed period keeps its revisions (`period_signature`, append-only) and amendments
 *   (`period_amendment`, append-only); `reporting_period.revision` counts the signatures.
 * - While a period is signed, PostgreSQL refuses to insert, change or delete the results,
 *   samples, certificates, QC batches, flow readings and limit versions that fed it, whoever
 *   asks (SQLSTATE DL409, answered 409 by the API). An open amendment lifts the lock for its
 *   period only, and every trail entry written while it lifts the lock carries its id.
 */
export class PeriodSignOff1796241600000 implements MigrationInterface {
  name = 'PeriodSignOff1796241600000';

  async up(q: QueryRunner): Promise<void> {
    // Limit versions.
    await q.query(`CREATE EXTENSION IF NOT EXISTS btree_gist`);
    await q.query(`ALTER TABLE permit_limit ADD COLUMN applies_from date, ADD COLUMN applies_to date, ADD COLUMN series_id uuid`);
    await q.query(`ALTER TABLE permit_limit DISABLE TRIGGER permit_limit_outside_decant`);
    await q.query(`UPDATE permit_limit l SET applies_from = p.effective_from, series_id = l.id FROM permit p WHERE p.id = l.permit_id`);
    await q.query(`ALTER TABLE permit_limit ENABLE TRIGGER permit_limit_outside_decant`);
    await q.query(`ALTER TABLE permit_limit ALTER COLUMN applies_from SET NOT NULL, ALTER COLUMN series_id SET NOT NULL,
      ADD CONSTRAINT permit_limit_applies_check CHECK (applies_to IS NULL OR applies_to >= applies_from)`);
    await q.query(`DROP INDEX "UQ_permit_limit_basis"`);
    await q.query(`ALTER TABLE permit_limit ADD CONSTRAINT "EX_permit_limit_versions" EXCLUDE USING gist (
      permit_id WITH =, discharge_point_id WITH =, parameter_id WITH =, statistic WITH =,
      ((unit)::text = ANY ((ARRAY['lb/day'::character varying, 'kg/day'::character varying])::text[])) WITH =,
      daterange(applies_from, applies_to, '[]') WITH &&)`);
    await q.query(`CREATE INDEX "IDX_permit_limit_series" ON permit_limit (series_id)`);
    // A limit entered without a start applies from its permit's; a first version starts its own series.
    await q.query(`CREATE FUNCTION permit_limit_defaults() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        NEW.applies_from := coalesce(NEW.applies_from, (SELECT effective_from FROM permit WHERE id = NEW.permit_id));
        NEW.series_id := coalesce(NEW.series_id, NEW.id);
        RETURN NEW;
      END $$`);
    await q.query(
      `CREATE TRIGGER permit_limit_defaults BEFORE INSERT ON permit_limit FOR EACH ROW EXECUTE FUNCTION permit_limit_defaults()`,
    );

    // Monitoring frequencies count sampling days unless the permit says every sample counts.
    await q.query(`ALTER TABLE permit ADD COLUMN monitoring_counts varchar(14) NOT NULL DEFAULT 'sampling-days'
      CONSTRAINT permit_monitoring_counts_check CHECK ((monitoring_counts)::text = ANY ((ARRAY['sampling-days'::character varying, 'samples'::character varying])::text[]))`);

    // Signatures and amendments.
    await q.query(`ALTER TABLE reporting_period ADD COLUMN revision smallint NOT NULL DEFAULT 0`);
    await q.query(`CREATE TABLE period_amendment (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      period_id uuid NOT NULL CONSTRAINT period_amendment_period_id_fkey REFERENCES reporting_period(id) ON DELETE RESTRICT,
      amends_revision smallint NOT NULL,
      reason text NOT NULL CONSTRAINT period_amendment_reason_check CHECK (length(btrim(reason)) > 0),
      opened_by uuid CONSTRAINT period_amendment_opened_by_fkey REFERENCES app_user(id),
      opened_by_name varchar(200) NOT NULL,
      opened_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT period_amendment_period_id_amends_revision_key UNIQUE (period_id, amends_revision)
    )`);
    await q.query(`CREATE TABLE period_signature (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      period_id uuid NOT NULL CONSTRAINT period_signature_period_id_fkey REFERENCES reporting_period(id) ON DELETE RESTRICT,
      revision smallint NOT NULL CONSTRAINT period_signature_revision_check CHECK (revision >= 1),
      amendment_id uuid CONSTRAINT period_signature_amendment_id_fkey REFERENCES period_amendment(id) ON DELETE RESTRICT,
      signed_by uuid CONSTRAINT period_signature_signed_by_fkey REFERENCES app_user(id),
      signer_name varchar(200) NOT NULL,
      signer_title varchar(200) NOT NULL,
      signed_at timestamptz NOT NULL DEFAULT now(),
      statement_section varchar(40) NOT NULL,
      statement text NOT NULL,
      acknowledged jsonb NOT NULL,
      acknowledgement_note text,
      summary jsonb NOT NULL,
      inputs jsonb NOT NULL,
      trail_head_seq bigint NOT NULL,
      trail_head_hash char(64) NOT NULL,
      sha256 char(64) NOT NULL,
      CONSTRAINT period_signature_period_id_revision_key UNIQUE (period_id, revision)
    )`);
    await q.query(`CREATE FUNCTION refuse_change_of_kept_record() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        RAISE EXCEPTION '% is append-only: % refused', TG_TABLE_NAME, TG_OP USING ERRCODE = 'insufficient_privilege';
      END $$`);
    for (const table of ['period_signature', 'period_amendment']) {
      await q.query(`CREATE TRIGGER ${table}_append_only BEFORE UPDATE OR DELETE ON ${table}
        FOR EACH ROW EXECUTE FUNCTION refuse_change_of_kept_record()`);
      await q.query(`CREATE TRIGGER ${table}_no_truncate BEFORE TRUNCATE ON ${table}
        FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_of_kept_record()`);
    }
    // A signed period's figures are its snapshot: only signing and amending move its state.
    await q.query(`CREATE FUNCTION reporting_period_keeps_signature() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF OLD.status = 'signed' AND NEW.status = 'signed'
           AND (NEW.summary IS DISTINCT FROM OLD.summary OR NEW.compiled_at IS DISTINCT FROM OLD.compiled_at OR NEW.revision <> OLD.revision) THEN
          RAISE EXCEPTION 'The period % – % is signed: its summary is its signed snapshot', OLD.starts_on, OLD.ends_on
            USING ERRCODE = 'DL409', HINT = 'Open an amendment on the period to change it';
        END IF;
        IF TG_OP = 'DELETE' AND OLD.status IN ('signed', 'amended') THEN
          RAISE EXCEPTION 'The period % – % is signed and kept', OLD.starts_on, OLD.ends_on USING ERRCODE = 'DL409';
        END IF;
        RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
      END $$`);
    await q.query(`CREATE TRIGGER reporting_period_keeps_signature BEFORE UPDATE OR DELETE ON reporting_period
      FOR EACH ROW EXECUTE FUNCTION reporting_period_keeps_signature()`);

    // The lock. One question for every table: does a signed period of a permit with limits at this
    // discharge point hold this day?
    await q.query(`CREATE FUNCTION period_lock_check(p_point uuid, p_day date) RETURNS void
      LANGUAGE plpgsql SECURITY DEFINER SET search_path = public AS $$
      DECLARE locked record; amendment uuid;
      BEGIN
        IF p_point IS NULL OR p_day IS NULL THEN RETURN; END IF;
        SELECT rp.starts_on, rp.ends_on, rp.revision, p.number INTO locked
          FROM reporting_period rp JOIN permit p ON p.id = rp.permit_id
         WHERE rp.status = 'signed' AND p_day BETWEEN rp.starts_on AND rp.ends_on
           AND EXISTS (SELECT 1 FROM permit_limit l WHERE l.permit_id = rp.permit_id AND l.discharge_point_id = p_point)
         LIMIT 1;
        IF FOUND THEN
          RAISE EXCEPTION 'The period % – % of permit % is signed (revision %) and holds this record',
            locked.starts_on, locked.ends_on, locked.number, locked.revision
            USING ERRCODE = 'DL409', HINT = 'Open an amendment on that period (with a reason), make the change, and sign it again';
        END IF;
        SELECT a.id INTO amendment
          FROM reporting_period rp JOIN period_amendment a ON a.period_id = rp.id AND a.amends_revision = rp.revision
         WHERE rp.status = 'amended' AND p_day BETWEEN rp.starts_on AND rp.ends_on
           AND EXISTS (SELECT 1 FROM permit_limit l WHERE l.permit_id = rp.permit_id AND l.discharge_point_id = p_point)
         LIMIT 1;
        IF FOUND THEN
          -- The trail entry of this change names the amendment (trail_entry_chain reads it).
          PERFORM set_config('decant.amendment_id', amendment::text, true);
        END IF;
      END $$`);
    await q.query(`CREATE FUNCTION period_lock_of_sample(p_sample uuid) RETURNS void LANGUAGE sql SECURITY DEFINER SET search_path = public AS $$
        SELECT period_lock_check(s.discharge_point_id, s.collected_on) FROM lab_sample s WHERE s.id = p_sample
      $$`);
    await q.query(`CREATE FUNCTION period_lock_of_certificate(p_certificate uuid) RETURNS void LANGUAGE sql SECURITY DEFINER SET search_path = public AS $$
        SELECT period_lock_check(s.discharge_point_id, s.collected_on) FROM lab_sample s WHERE s.certificate_id = p_certificate
      $$`);
    await q.query(`CREATE FUNCTION period_lock() RETURNS trigger LANGUAGE plpgsql SECURITY DEFINER SET search_path = public AS $$
      DECLARE r record;
      BEGIN
        FOREACH r IN ARRAY (CASE TG_OP WHEN 'INSERT' THEN ARRAY[NEW] WHEN 'DELETE' THEN ARRAY[OLD] ELSE ARRAY[OLD, NEW] END) LOOP
          CASE TG_TABLE_NAME
            WHEN 'lab_sample' THEN
              PERFORM period_lock_check(r.discharge_point_id, r.collected_on);
            WHEN 'flow_reading' THEN
              PERFORM period_lock_check(r.discharge_point_id, r.day);
            WHEN 'lab_result' THEN
              PERFORM period_lock_of_sample(r.sample_id);
            WHEN 'lab_certificate' THEN
              IF TG_OP <> 'INSERT' THEN PERFORM period_lock_of_certificate(r.id); END IF;
            WHEN 'qc_batch' THEN
              PERFORM period_lock_of_certificate(r.certificate_id);
          END CASE;
        END LOOP;
        RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
      END $$`);
    for (const table of lockedByDay) {
      await q.query(`CREATE TRIGGER ${table}_period_lock BEFORE INSERT OR UPDATE OR DELETE ON ${table}
        FOR EACH ROW EXECUTE FUNCTION period_lock()`);
    }
    // A limit version: what it says about a signed period may not change. Ending it after the
    // period, or adding a version that starts after it, leaves the period as it was signed.
    await q.query(`CREATE FUNCTION permit_limit_period_lock() RETURNS trigger LANGUAGE plpgsql SECURITY DEFINER SET search_path = public AS $$
      DECLARE locked record; unchanged boolean;
      BEGIN
        FOR locked IN
          SELECT rp.starts_on, rp.ends_on, rp.revision, p.number
            FROM reporting_period rp JOIN permit p ON p.id = rp.permit_id
           WHERE rp.status = 'signed' AND rp.permit_id = CASE WHEN TG_OP = 'INSERT' THEN NEW.permit_id ELSE OLD.permit_id END
        LOOP
          IF TG_OP = 'INSERT' THEN
            unchanged := NOT (daterange(NEW.applies_from, NEW.applies_to, '[]') && daterange(locked.starts_on, locked.ends_on, '[]'));
          ELSIF TG_OP = 'DELETE' THEN
            unchanged := NOT (daterange(OLD.applies_from, OLD.applies_to, '[]') && daterange(locked.starts_on, locked.ends_on, '[]'));
          ELSE
            unchanged := NOT (daterange(OLD.applies_from, OLD.applies_to, '[]') && daterange(locked.starts_on, locked.ends_on, '[]'))
                         AND NOT (daterange(NEW.applies_from, NEW.applies_to, '[]') && daterange(locked.starts_on, locked.ends_on, '[]'))
              OR (to_jsonb(NEW) - 'applies_to' - 'updated_at') = (to_jsonb(OLD) - 'applies_to' - 'updated_at')
                 AND least(coalesce(NEW.applies_to, 'infinity'::date), locked.ends_on) = least(coalesce(OLD.applies_to, 'infinity'::date), locked.ends_on);
          END IF;
          IF NOT unchanged THEN
            RAISE EXCEPTION 'The period % – % of permit % is signed (revision %) and was judged by this limit',
              locked.starts_on, locked.ends_on, locked.number, locked.revision
              USING ERRCODE = 'DL409', HINT = 'Give the new version a start after that period, or open an amendment on it';
          END IF;
        END LOOP;
        RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
      END $$`);
    await q.query(`CREATE TRIGGER permit_limit_period_lock BEFORE INSERT OR UPDATE OR DELETE ON permit_limit
      FOR EACH ROW EXECUTE FUNCTION permit_limit_period_lock()`);
    // The permit's settings that change results are locked the same way while any of its periods is signed.
    await q.query(`CREATE FUNCTION permit_settings_period_lock() RETURNS trigger LANGUAGE plpgsql SECURITY DEFINER SET search_path = public AS $$
      DECLARE locked record;
      BEGIN
        IF (NEW.non_detect_policy, NEW.mass_loading_factor, NEW.daily_max_applies_to_each_grab, NEW.late_report_days, NEW.snc_window, NEW.kind, NEW.monitoring_counts)
           IS NOT DISTINCT FROM
           (OLD.non_detect_policy, OLD.mass_loading_factor, OLD.daily_max_applies_to_each_grab, OLD.late_report_days, OLD.snc_window, OLD.kind, OLD.monitoring_counts) THEN
          RETURN NEW;
        END IF;
        SELECT rp.starts_on, rp.ends_on, rp.revision INTO locked FROM reporting_period rp
         WHERE rp.permit_id = OLD.id AND rp.status = 'signed' ORDER BY rp.starts_on DESC LIMIT 1;
        IF FOUND THEN
          RAISE EXCEPTION 'The period % – % of permit % is signed (revision %) and was computed with these settings',
            locked.starts_on, locked.ends_on, OLD.number, locked.revision
            USING ERRCODE = 'DL409', HINT = 'Open an amendment on that period to change them';
        END IF;
        RETURN NEW;
      END $$`);
    await q.query(`CREATE TRIGGER permit_settings_period_lock BEFORE UPDATE ON permit
      FOR EACH ROW EXECUTE FUNCTION permit_settings_period_lock()`);

    // The trail names the amendment a change was made under, and the chain covers it (concat_ws
    // skips a null, so the hashes of entries written before stay what they were).
    await q.query(`ALTER TABLE trail_entry ADD COLUMN amendment_id uuid`);
    await q.query(`CREATE OR REPLACE FUNCTION trail_entry_digest(prev char(64), e trail_entry) RETURNS char(64)
      LANGUAGE sql IMMUTABLE AS $$
        SELECT encode(sha256(convert_to(concat_ws('|', prev, e.chain_seq, to_char(e.occurred_at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US'),
          e.actor_id, e.actor_email, e.action, e.entity, e.entity_id, e.site_id, e.before::text, e.after::text, e.amendment_id), 'UTF8')), 'hex')
      $$`);
    await q.query(`CREATE OR REPLACE FUNCTION trail_entry_chain() RETURNS trigger LANGUAGE plpgsql SECURITY DEFINER SET search_path = public AS $$
      DECLARE head trail_chain_head;
      BEGIN
        NEW.amendment_id := coalesce(NEW.amendment_id, nullif(current_setting('decant.amendment_id', true), '')::uuid);
        -- The head's row lock serialises writers; FOR UPDATE reads its latest committed version.
        SELECT * INTO head FROM trail_chain_head FOR UPDATE;
        NEW.chain_seq := head.seq + 1;
        NEW.prev_hash := head.hash;
        NEW.hash := trail_entry_digest(head.hash, NEW);
        UPDATE trail_chain_head SET seq = NEW.chain_seq, hash = NEW.hash;
        RETURN NEW;
      END $$`);
    await q.query(`CREATE INDEX "IDX_trail_entry_amendment" ON trail_entry (amendment_id) WHERE amendment_id IS NOT NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "IDX_trail_entry_amendment"`);
    await q.query(`CREATE OR REPLACE FUNCTION trail_entry_chain() RETURNS trigger LANGUAGE plpgsql SECURITY DEFINER SET search_path = public AS $$
      DECLARE head trail_chain_head;
      BEGIN
        SELECT * INTO head FROM trail_chain_head FOR UPDATE;
        NEW.chain_seq := head.seq + 1;
        NEW.prev_hash := head.hash;
        NEW.hash := trail_entry_digest(head.hash, NEW);
        UPDATE trail_chain_head SET seq = NEW.chain_seq, hash = NEW.hash;
        RETURN NEW;
      END $$`);
    await q.query(`CREATE OR REPLACE FUNCTION trail_entry_digest(prev char(64), e trail_entry) RETURNS char(64)
      LANGUAGE sql IMMUTABLE AS $$
        SELECT encode(sha256(convert_to(concat_ws('|', prev, e.chain_seq, to_char(e.occurred_at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US'),
          e.actor_id, e.actor_email, e.action, e.entity, e.entity_id, e.site_id, e.before::text, e.after::text), 'UTF8')), 'hex')
      $$`);
    await q.query(`ALTER TABLE trail_entry DROP COLUMN amendment_id`);
    await q.query(`DROP TRIGGER permit_settings_period_lock ON permit`);
    await q.query(`DROP FUNCTION permit_settings_period_lock()`);
    await q.query(`DROP TRIGGER permit_limit_period_lock ON permit_limit`);
    await q.query(`DROP FUNCTION permit_limit_period_lock()`);
    for (const table of lockedByDay) await q.query(`DROP TRIGGER ${table}_period_lock ON ${table}`);
    await q.query(`DROP FUNCTION period_lock()`);
    await q.query(`DROP FUNCTION period_lock_of_certificate(uuid)`);
    await q.query(`DROP FUNCTION period_lock_of_sample(uuid)`);
    await q.query(`DROP FUNCTION period_lock_check(uuid, date)`);
    await q.query(`DROP TRIGGER reporting_period_keeps_signature ON reporting_period`);
    await q.query(`DROP FUNCTION reporting_period_keeps_signature()`);
    await q.query(`DROP TABLE period_signature`);
    await q.query(`DROP TABLE period_amendment`);
    await q.query(`DROP FUNCTION refuse_change_of_kept_record()`);
    await q.query(`ALTER TABLE reporting_period DROP COLUMN revision`);
    await q.query(`ALTER TABLE permit DROP COLUMN monitoring_counts`);
    await q.query(`DROP TRIGGER permit_limit_defaults ON permit_limit`);
    await q.query(`DROP FUNCTION permit_limit_defaults()`);
    await q.query(`DROP INDEX "IDX_permit_limit_series"`);
    await q.query(`ALTER TABLE permit_limit DROP CONSTRAINT "EX_permit_limit_versions"`);
    await q.query(`CREATE UNIQUE INDEX "UQ_permit_limit_basis" ON permit_limit
      (permit_id, discharge_point_id, parameter_id, statistic, ((unit)::text = ANY ((ARRAY['lb/day'::character varying, 'kg/day'::character varying])::text[])))`);
    await q.query(
      `ALTER TABLE permit_limit DROP CONSTRAINT permit_limit_applies_check, DROP COLUMN applies_from, DROP COLUMN applies_to, DROP COLUMN series_id`,
    );
  }
}
