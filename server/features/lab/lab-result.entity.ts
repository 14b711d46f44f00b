import { Check, Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { Flag } from '../../contracts/flags.js';
import { numeric } from '../../db/numeric-transformer.js';
import { LabSample } from './lab-sample.entity.js';
import { Parameter } from '../parameters/parameter.entity.js';
import { QcBatch } from './qc-batch.entity.js';

@Check('lab_result_qualifier_check', `(qualifier = '<'::bpchar)`)
@Index('IDX_lab_result_sample', ['sampleId'])
@Index('IDX_lab_result_parameter', ['parameterId'])
// A GIN index, which TypeORM does not describe: kept by the migration.
@Index('IDX_lab_result_flag_codes', { synchronize: false })
@Index('IDX_lab_result_sample_parameter', ['sampleId', 'parameterId'])
@Entity('lab_result')
export class LabResult {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'sample_id' })
  sampleId: string;

  @ManyToOne(() => LabSample, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'sample_id', foreignKeyConstraintName: 'lab_result_sample_id_fkey' })
  sample?: LabSample;

  @Column({ type: 'uuid', name: 'parameter_id' })
  parameterId: string;

  @ManyToOne(() => Parameter, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'parameter_id', foreignKeyConstraintName: 'lab_result_parameter_id_fkey' })
  parameter?: Parameter;

  @Column({ type: 'varchar', length: 40 })
  method: string;

  @Column({ type: 'char', length: 1, nullable: true })
  qualifier: '<' | null;

  @Column({ type: 'varchar', name: 'value_reported', length: 32 })
  valueReported: string;

  @Column({ type: 'numeric', precision: 18, scale: 6, transformer: numeric })
  value: number;

  @Column({ type: 'numeric', precision: 12, scale: 4, nullable: true, transformer: numeric })
  mdl: number | null;

  @Column({ type: 'numeric', precision: 12, scale: 4, nullable: true, transformer: numeric })
  ml: number | null;

  @Column({ type: 'varchar', length: 20 })
  unit: string;

  @Column({ type: 'timestamptz', name: 'analysed_at', nullable: true })
  analysedAt: Date | null;

  @Column({ type: 'uuid', name: 'qc_batch_id', nullable: true })
  qcBatchId: string | null;

  @ManyToOne(() => QcBatch, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'qc_batch_id', foreignKeyConstraintName: 'lab_result_qc_batch_id_fkey' })
  qcBatch?: QcBatch;

  @Column({ type: 'jsonb', default: '[]' })
  flags: Flag[];

  @Column({ type: 'text', name: 'flag_codes', array: true, default: '{}' })
  flagCodes: string[];
}
