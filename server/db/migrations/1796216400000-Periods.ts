import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Daily flow readings and the reporting periods of each permit with their saved summaries. */
export class Periods1796216400000 implements MigrationInterface {
  name = 'Periods1796216400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE flow_reading (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      discharge_point_id uuid NOT NULL REFERENCES discharge_point(id) ON DELETE RESTRICT,
      day date NOT NULL,
      value numeric(14,4) NOT NULL CHECK (value >= 0),
      unit varchar(10) NOT NULL CHECK (unit IN ('gal/day', 'MGD', 'm³/day')),
      entered_by uuid REFERENCES app_user(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (discharge_point_id, day)
    )`);
    await q.query(`CREATE TABLE reporting_period (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      permit_id uuid NOT NULL REFERENCES permit(id) ON DELETE CASCADE,
      starts_on date NOT NULL,
      ends_on date NOT NULL,
      due_on date NOT NULL,
      status varchar(10) NOT NULL DEFAULT 'open' CHECK (status IN ('open', 'compiled', 'signed', 'amended')),
      compiled_at timestamptz,
      summary jsonb,
      UNIQUE (permit_id, starts_on),
      CHECK (ends_on >= starts_on)
    )`);
    await q.query(`CREATE INDEX "IDX_lab_result_sample_parameter" ON lab_result (sample_id, parameter_id)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP INDEX "IDX_lab_result_sample_parameter"');
    await q.query('DROP TABLE reporting_period');
    await q.query('DROP TABLE flow_reading');
  }
}
