import { Check, Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique } from 'typeorm';
import type { FlowReadingView } from '../../contracts/flow-readings.js';
import { numeric } from '../../db/numeric-transformer.js';
import { DischargePoint } from '../discharge-points/discharge-point.entity.js';
import { User } from '../../kernel/people/user.entity.js';

@Check('flow_reading_value_check', `(value >= (0)::numeric)`)
@Check(
  'flow_reading_unit_check',
  `((unit)::text = ANY ((ARRAY['gal/day'::character varying, 'MGD'::character varying, 'm³/day'::character varying])::text[]))`,
)
@Unique('flow_reading_discharge_point_id_day_key', ['dischargePointId', 'day'])
@Entity('flow_reading')
export class FlowReading {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'discharge_point_id' })
  dischargePointId: string;

  @ManyToOne(() => DischargePoint, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'discharge_point_id', foreignKeyConstraintName: 'flow_reading_discharge_point_id_fkey' })
  dischargePoint?: DischargePoint;

  @Column({ type: 'date' })
  day: string;

  @Column({ type: 'numeric', precision: 14, scale: 4, transformer: numeric })
  value: number;

  @Column({ type: 'varchar', length: 10 })
  unit: FlowReadingView['unit'];

  @Column({ type: 'uuid', name: 'entered_by', nullable: true })
  enteredBy: string | null;

  @ManyToOne(() => User, { onDelete: 'NO ACTION' })
  @JoinColumn({ name: 'entered_by', foreignKeyConstraintName: 'flow_reading_entered_by_fkey' })
  enteredByRef?: User;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;
}
