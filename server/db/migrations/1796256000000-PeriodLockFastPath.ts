import type { QueryRunner, MigrationInterface } from 'typeorm';

/**
 * The period lock, checked for every row written, costs little: the helpers that find a
 * sample's or a certificate's days become PL/pgSQL (their plans are kept; SQL functions were
 * planned again on every call), and a site with no signed or amended period at all (a partial
 * index answers) skips the check. Bulk inserts of results had become ~2 ms a row.
 */
export class PeriodLockFastPath1796256000000 implements MigrationInterface {
  name = 'PeriodLockFastPath1796256000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE INDEX "IDX_reporting_period_locked" ON reporting_period (permit_id) WHERE status IN ('signed', 'amended')`);
    await q.query(`CREATE OR REPLACE FUNCTION period_lock_of_sample(p_sample uuid) RETURNS void
      LANGUAGE plpgsql SECURITY DEFINER SET search_path = public AS $$
      DECLARE point uuid; day date;
      BEGIN
        IF NOT EXISTS (SELECT 1 FROM reporting_period WHERE status IN ('signed', 'amended')) THEN RETURN; END IF;
        SELECT s.discharge_point_id, s.collected_on INTO point, day FROM lab_sample s WHERE s.id = p_sample;
        PERFORM period_lock_check(point, day);
      END $$`);
    await q.query(`CREATE OR REPLACE FUNCTION period_lock_of_certificate(p_certificate uuid) RETURNS void
      LANGUAGE plpgsql SECURITY DEFINER SET search_path = public AS $$
      DECLARE sample record;
      BEGIN
        IF NOT EXISTS (SELECT 1 FROM reporting_period WHERE status IN ('signed', 'amended')) THEN RETURN; END IF;
        FOR sample IN SELECT DISTINCT s.discharge_point_id, s.collected_on FROM lab_sample s WHERE s.certificate_id = p_certificate LOOP
          PERFORM period_lock_check(sample.discharge_point_id, sample.collected_on);
        END LOOP;
      END $$`);
    // The check itself returns at once where nothing is signed or amended.
    await q.query(`CREATE OR REPLACE FUNCTION period_lock() RETURNS trigger LANGUAGE plpgsql SECURITY DEFINER SET search_path = public AS $$
      DECLARE r record;
      BEGIN
        IF NOT EXISTS (SELECT 1 FROM reporting_period WHERE status IN ('signed', 'amended')) THEN
          RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
        END IF;
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
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`CREATE OR REPLACE FUNCTION period_lock_of_sample(p_sample uuid) RETURNS void LANGUAGE sql SECURITY DEFINER SET search_path = public AS $$
        SELECT period_lock_check(s.discharge_point_id, s.collected_on) FROM lab_sample s WHERE s.id = p_sample
      $$`);
    await q.query(`CREATE OR REPLACE FUNCTION period_lock_of_certificate(p_certificate uuid) RETURNS void LANGUAGE sql SECURITY DEFINER SET search_path = public AS $$
        SELECT period_lock_check(s.discharge_point_id, s.collected_on) FROM lab_sample s WHERE s.certificate_id = p_certificate
      $$`);
    await q.query(`DROP INDEX "IDX_reporting_period_locked"`);
  }
}
