import { Column, Entity, Index, PrimaryColumn } from 'typeorm';

@Index('IDX_session_expire', ['expire'])
@Entity('session')
export class Session {
  @PrimaryColumn({ type: 'varchar' })
  sid: string;

  @Column({ type: 'json' })
  sess: unknown;

  @Column({ type: 'timestamp' })
  expire: Date;
}
