import { Check, Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { Flag } from '../../contracts/flags.js';
import type { SampleView } from '../../contracts/lab.js';
import { numeric } from '../../db/numeric-transformer.js';
import { DischargePoint } from '../discharge-points/discharge-point.entity.js';
import { LabCertificate } from './lab-certificate.entity.js';

@Check(
  'lab_sample_sample_type_check',
  `((sample_type)::text = ANY ((ARRAY['grab'::character varying, 'composite'::character varying, 'lab-composite-of-grabs'::character varying])::text[]))`,
)
@Index('IDX_lab_sample_point_day', ['dischargePointId', 'collectedOn'])
@Index('IDX_lab_sample_certificate', ['certificateId'])
@Entity('lab_sample')
export class LabSample {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'certificate_id' })
  certificateId: string;

  @ManyToOne(() => LabCertificate, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'certificate_id', foreignKeyConstraintName: 'lab_sample_certificate_id_fkey' })
  certificate?: LabCertificate;

  @Column({ type: 'uuid', name: 'discharge_point_id' })
  dischargePointId: string;

  @ManyToOne(() => DischargePoint, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'discharge_point_id', foreignKeyConstraintName: 'lab_sample_discharge_point_id_fkey' })
  dischargePoint?: DischargePoint;

  @Column({ type: 'timestamptz', name: 'collected_at' })
  collectedAt: Date;

  @Column({ type: 'date', name: 'collected_on' })
  collectedOn: string;

  @Column({ type: 'varchar', name: 'collected_by', length: 120 })
  collectedBy: string;

  @Column({ type: 'varchar', name: 'sample_type', length: 24 })
  sampleType: SampleView['sampleType'];

  @Column({ type: 'boolean', name: 'preservation_confirmed' })
  preservationConfirmed: boolean;

  @Column({ type: 'numeric', name: 'temperature_on_receipt_c', precision: 5, scale: 1, nullable: true, transformer: numeric })
  temperatureOnReceiptC: number | null;

  @Column({ type: 'varchar', name: 'chain_of_custody_number', length: 60, nullable: true })
  chainOfCustodyNumber: string | null;

  @Column({ type: 'jsonb', default: '[]' })
  flags: Flag[];
}
