import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Discharge points, parameters, permits and limits; stored files; lab certificates, samples, results, QC. */
export class SetupAndLab1796209200000 implements MigrationInterface {
  name = 'SetupAndLab1796209200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE discharge_point (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      site_id uuid NOT NULL REFERENCES site(id) ON DELETE RESTRICT,
      code varchar(40) NOT NULL,
      name varchar(200) NOT NULL,
      receiving varchar(20) NOT NULL CHECK (receiving IN ('sewer', 'surface-water')),
      active boolean NOT NULL DEFAULT true,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (site_id, code)
    )`);
    await q.query(`CREATE TABLE parameter (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      site_id uuid REFERENCES site(id) ON DELETE RESTRICT,
      code varchar(60) NOT NULL,
      name varchar(200) NOT NULL,
      fraction varchar(10) CHECK (fraction IN ('HEM', 'SGT-HEM')),
      default_unit varchar(20) NOT NULL,
      snc_review_factor numeric(4,2),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(
      `CREATE UNIQUE INDEX "UQ_parameter_code" ON parameter (coalesce(site_id, '00000000-0000-0000-0000-000000000000'::uuid), code)`,
    );
    // The shared catalogue. The technical-review factor is 40 CFR 403.8(f)(2)(viii)(B): 1.4 for BOD,
    // TSS, fats, oil and grease; 1.2 for other pollutants; none for pH (and for flow, not a pollutant).
    await q.query(`INSERT INTO parameter (code, name, fraction, default_unit, snc_review_factor) VALUES
      ('oil-grease-hem', 'Oil and grease (HEM, Method 1664)', 'HEM', 'mg/L', 1.4),
      ('non-polar-sgt-hem', 'Non-polar material (SGT-HEM, Method 1664)', 'SGT-HEM', 'mg/L', 1.4),
      ('ph', 'pH', NULL, 'SU', NULL),
      ('flow', 'Flow', NULL, 'gal/day', NULL),
      ('tss', 'Total suspended solids', NULL, 'mg/L', 1.4),
      ('temperature', 'Temperature', NULL, '°C', 1.2)`);
    await q.query(`CREATE TABLE permit (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      site_id uuid NOT NULL REFERENCES site(id) ON DELETE RESTRICT,
      kind varchar(20) NOT NULL CHECK (kind IN ('pretreatment', 'npdes')),
      number varchar(60) NOT NULL,
      issuing_authority varchar(200) NOT NULL,
      authority_email varchar(254),
      effective_from date NOT NULL,
      effective_to date,
      reporting_frequency varchar(12) NOT NULL CHECK (reporting_frequency IN ('monthly', 'quarterly', 'semiannual')),
      report_due_days smallint NOT NULL CHECK (report_due_days BETWEEN 0 AND 365),
      non_detect_policy varchar(10) NOT NULL CHECK (non_detect_policy IN ('zero', 'mdl', 'ml', 'half-mdl')),
      daily_max_applies_to_each_grab boolean NOT NULL DEFAULT false,
      mass_loading_factor numeric(6,4) NOT NULL CHECK (mass_loading_factor IN (8.34, 8.3454)),
      snc_window varchar(16) NOT NULL CHECK (snc_window IN ('calendar-halves', 'rolling')),
      late_report_days smallint NOT NULL DEFAULT 45 CHECK (late_report_days BETWEEN 1 AND 365),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (site_id, number),
      CHECK (effective_to IS NULL OR effective_to >= effective_from)
    )`);
    await q.query(`CREATE TABLE permit_limit (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      permit_id uuid NOT NULL REFERENCES permit(id) ON DELETE CASCADE,
      discharge_point_id uuid NOT NULL REFERENCES discharge_point(id) ON DELETE RESTRICT,
      parameter_id uuid NOT NULL REFERENCES parameter(id) ON DELETE RESTRICT,
      statistic varchar(24) NOT NULL CHECK (statistic IN ('daily-maximum', 'monthly-average', 'instantaneous-minimum', 'instantaneous-maximum')),
      value numeric(14,4) NOT NULL,
      unit varchar(20) NOT NULL,
      frequency_count smallint NOT NULL CHECK (frequency_count BETWEEN 1 AND 1000),
      frequency_per varchar(8) NOT NULL CHECK (frequency_per IN ('day', 'week', 'month', 'quarter')),
      sample_type varchar(10) NOT NULL CHECK (sample_type IN ('grab', 'composite')),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (permit_id, discharge_point_id, parameter_id, statistic)
    )`);
    await q.query(`CREATE INDEX "IDX_permit_limit_point" ON permit_limit (discharge_point_id, parameter_id)`);

    await q.query(`CREATE TABLE stored_file (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      sha256 char(64) NOT NULL,
      file_name varchar(255) NOT NULL,
      media_type varchar(100) NOT NULL,
      size_bytes integer NOT NULL CHECK (size_bytes > 0),
      content bytea NOT NULL,
      uploaded_by uuid REFERENCES app_user(id),
      created_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE TABLE lab_certificate (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      site_id uuid NOT NULL REFERENCES site(id) ON DELETE RESTRICT,
      lab_name varchar(200) NOT NULL,
      lab_accreditation_number varchar(60) NOT NULL,
      report_number varchar(60) NOT NULL,
      received_on date NOT NULL,
      file_id uuid REFERENCES stored_file(id),
      flags jsonb NOT NULL DEFAULT '[]',
      created_by uuid REFERENCES app_user(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (lab_name, report_number)
    )`);
    await q.query(`CREATE INDEX "IDX_lab_certificate_site_received" ON lab_certificate (site_id, received_on DESC)`);
    await q.query(`CREATE TABLE qc_batch (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      certificate_id uuid NOT NULL REFERENCES lab_certificate(id) ON DELETE CASCADE,
      code varchar(60) NOT NULL,
      fraction varchar(10) NOT NULL CHECK (fraction IN ('HEM', 'SGT-HEM')),
      opr_recovery_pct numeric(7,2),
      ms_recovery_pct numeric(7,2),
      msd_recovery_pct numeric(7,2),
      rpd_pct numeric(7,2),
      method_blank numeric(12,4),
      spike_true numeric(12,4),
      spike_background numeric(12,4),
      ms_found numeric(12,4),
      msd_found numeric(12,4),
      flags jsonb NOT NULL DEFAULT '[]',
      UNIQUE (certificate_id, code)
    )`);
    await q.query(`CREATE TABLE lab_sample (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      certificate_id uuid NOT NULL REFERENCES lab_certificate(id) ON DELETE CASCADE,
      discharge_point_id uuid NOT NULL REFERENCES discharge_point(id) ON DELETE RESTRICT,
      collected_at timestamptz NOT NULL,
      collected_on date NOT NULL,
      collected_by varchar(120) NOT NULL,
      sample_type varchar(24) NOT NULL CHECK (sample_type IN ('grab', 'composite', 'lab-composite-of-grabs')),
      preservation_confirmed boolean NOT NULL,
      temperature_on_receipt_c numeric(5,1),
      chain_of_custody_number varchar(60),
      flags jsonb NOT NULL DEFAULT '[]'
    )`);
    await q.query(`CREATE INDEX "IDX_lab_sample_point_day" ON lab_sample (discharge_point_id, collected_on)`);
    await q.query(`CREATE INDEX "IDX_lab_sample_certificate" ON lab_sample (certificate_id)`);
    await q.query(`CREATE TABLE lab_result (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      sample_id uuid NOT NULL REFERENCES lab_sample(id) ON DELETE CASCADE,
      parameter_id uuid NOT NULL REFERENCES parameter(id) ON DELETE RESTRICT,
      method varchar(40) NOT NULL,
      qualifier char(1) CHECK (qualifier = '<'),
      value_reported varchar(32) NOT NULL,
      value numeric(18,6) NOT NULL,
      mdl numeric(12,4),
      ml numeric(12,4),
      unit varchar(20) NOT NULL,
      analysed_at timestamptz,
      qc_batch_id uuid REFERENCES qc_batch(id) ON DELETE SET NULL,
      flags jsonb NOT NULL DEFAULT '[]',
      flag_codes text[] NOT NULL DEFAULT '{}'
    )`);
    await q.query(`CREATE INDEX "IDX_lab_result_sample" ON lab_result (sample_id)`);
    await q.query(`CREATE INDEX "IDX_lab_result_parameter" ON lab_result (parameter_id)`);
    await q.query(`CREATE INDEX "IDX_lab_result_flag_codes" ON lab_result USING gin (flag_codes)`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of [
      'lab_result',
      'lab_sample',
      'qc_batch',
      'lab_certificate',
      'stored_file',
      'permit_limit',
      'permit',
      'parameter',
      'discharge_point',
    ]) {
      await q.query(`DROP TABLE ${table}`);
    }
  }
}
