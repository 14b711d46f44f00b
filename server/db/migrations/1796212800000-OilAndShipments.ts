import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Equipment, oil log, upkeep checks, shipments with their scans, follow-ups, and each user's unit preference. */
export class OilAndShipments1796212800000 implements MigrationInterface {
  name = 'OilAndShipments1796212800000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE app_user ADD COLUMN unit_system varchar(8) NOT NULL DEFAULT 'us' CHECK (unit_system IN ('us', 'metric'))`);
    await q.query(`ALTER TABLE site ADD COLUMN oil_opening_balance_litres numeric(12,2) NOT NULL DEFAULT 0,
                                     ADD COLUMN oil_opening_balance_on date`);
    await q.query(`CREATE TABLE equipment (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      site_id uuid NOT NULL REFERENCES site(id) ON DELETE RESTRICT,
      name varchar(120) NOT NULL,
      kind varchar(24) NOT NULL CHECK (kind IN ('belt-skimmer', 'drum-skimmer', 'disc-skimmer', 'tube-skimmer', 'mop-skimmer', 'oil-water-separator', 'sump')),
      serves varchar(200) NOT NULL DEFAULT '',
      rated_capacity numeric(10,2) NOT NULL CHECK (rated_capacity > 0),
      rated_unit varchar(8) NOT NULL CHECK (rated_unit IN ('gal/h', 'L/h')),
      medium_material varchar(80),
      upkeep_interval_days smallint NOT NULL CHECK (upkeep_interval_days BETWEEN 1 AND 366),
      specific_gravity numeric(4,3) NOT NULL DEFAULT 0.88 CHECK (specific_gravity > 0.5 AND specific_gravity < 1.2),
      active boolean NOT NULL DEFAULT true,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (site_id, name)
    )`);
    await q.query(`CREATE TABLE oil_log_entry (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      equipment_id uuid NOT NULL REFERENCES equipment(id) ON DELETE RESTRICT,
      site_id uuid NOT NULL REFERENCES site(id) ON DELETE RESTRICT,
      collected_on date NOT NULL,
      volume_litres numeric(14,6) NOT NULL CHECK (volume_litres >= 0),
      entered_volume numeric(12,3) NOT NULL,
      entered_unit varchar(4) NOT NULL CHECK (entered_unit IN ('gal', 'L')),
      hours_run numeric(4,1) CHECK (hours_run >= 0 AND hours_run <= 24),
      water_temperature_c numeric(4,1),
      observations text[] NOT NULL DEFAULT '{}',
      note text NOT NULL DEFAULT '',
      flags jsonb NOT NULL DEFAULT '[]',
      entered_by uuid NOT NULL REFERENCES app_user(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE INDEX "IDX_oil_log_site_day" ON oil_log_entry (site_id, collected_on)`);
    await q.query(`CREATE INDEX "IDX_oil_log_equipment_day" ON oil_log_entry (equipment_id, collected_on)`);
    await q.query(`CREATE TABLE upkeep_check (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      equipment_id uuid NOT NULL REFERENCES equipment(id) ON DELETE RESTRICT,
      site_id uuid NOT NULL REFERENCES site(id) ON DELETE RESTRICT,
      checked_on date NOT NULL,
      items jsonb NOT NULL,
      immersion_value numeric(6,2),
      immersion_unit varchar(4) CHECK (immersion_unit IN ('in', 'cm')),
      failed_count smallint NOT NULL DEFAULT 0,
      checked_by uuid NOT NULL REFERENCES app_user(id),
      created_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE INDEX "IDX_upkeep_check_equipment_day" ON upkeep_check (equipment_id, checked_on DESC)`);
    await q.query(`CREATE TABLE shipment (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      site_id uuid NOT NULL REFERENCES site(id) ON DELETE RESTRICT,
      shipped_on date NOT NULL,
      document_kind varchar(32) NOT NULL CHECK (document_kind IN ('hazardous-waste-manifest', 'used-oil-bill-of-lading', 'non-hazardous-manifest')),
      document_number varchar(40) NOT NULL,
      transporter_name varchar(200) NOT NULL,
      transporter_epa_id char(12) NOT NULL,
      receiver_name varchar(200) NOT NULL,
      receiver_epa_id char(12) NOT NULL,
      waste_description varchar(300) NOT NULL,
      quantity numeric(12,2) NOT NULL CHECK (quantity > 0),
      quantity_unit varchar(4) NOT NULL CHECK (quantity_unit IN ('gal', 'L')),
      quantity_litres numeric(14,6) NOT NULL,
      total_halogens_ppm numeric(10,1),
      burned_as_fuel boolean NOT NULL DEFAULT false,
      arsenic_ppm numeric(10,2), cadmium_ppm numeric(10,2), chromium_ppm numeric(10,2), lead_ppm numeric(10,2), flash_point_f numeric(6,1),
      signed_copy_received_on date,
      flags jsonb NOT NULL DEFAULT '[]',
      created_by uuid NOT NULL REFERENCES app_user(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (site_id, document_kind, document_number),
      CHECK (signed_copy_received_on IS NULL OR signed_copy_received_on >= shipped_on)
    )`);
    await q.query(`CREATE INDEX "IDX_shipment_site_day" ON shipment (site_id, shipped_on DESC)`);
    await q.query(`CREATE TABLE shipment_file (
      shipment_id uuid NOT NULL REFERENCES shipment(id) ON DELETE CASCADE,
      file_id uuid NOT NULL REFERENCES stored_file(id),
      PRIMARY KEY (shipment_id, file_id)
    )`);
    await q.query(`CREATE TABLE follow_up (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      site_id uuid NOT NULL REFERENCES site(id) ON DELETE RESTRICT,
      kind varchar(40) NOT NULL,
      source_entity varchar(40) NOT NULL,
      source_id uuid NOT NULL,
      title varchar(300) NOT NULL,
      due_at timestamptz NOT NULL,
      status varchar(12) NOT NULL DEFAULT 'open' CHECK (status IN ('open', 'done', 'done-late')),
      owner_id uuid REFERENCES app_user(id),
      closed_at timestamptz,
      closing_note text,
      created_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (kind, source_entity, source_id)
    )`);
    await q.query(`CREATE INDEX "IDX_follow_up_site_status_due" ON follow_up (site_id, status, due_at)`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of ['follow_up', 'shipment_file', 'shipment', 'upkeep_check', 'oil_log_entry', 'equipment'])
      await q.query(`DROP TABLE ${table}`);
    await q.query('ALTER TABLE site DROP COLUMN oil_opening_balance_litres, DROP COLUMN oil_opening_balance_on');
    await q.query('ALTER TABLE app_user DROP COLUMN unit_system');
  }
}
