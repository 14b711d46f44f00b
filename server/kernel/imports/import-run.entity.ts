import { Check, Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { ImportRunStatus } from '../../contracts/imports.js';
import { User } from '../people/user.entity.js';
import { Site } from '../sites/site.entity.js';

/** One import's run, written beside (not inside) the import's transaction. */
@Check(
  'import_run_status_check',
  `((status)::text = ANY ((ARRAY['reading'::character varying, 'checking'::character varying, 'writing'::character varying, 'done'::character varying, 'failed'::character varying])::text[]))`,
)
@Index('IDX_import_run_user_started', ['userId', 'startedAt'])
@Entity('import_run')
export class ImportRun {
  /** Chosen by the client, so it can ask how the run is doing while its upload is still open. */
  @PrimaryColumn({ type: 'uuid' })
  id: string;

  @Column({ type: 'uuid', name: 'site_id' })
  siteId: string;

  @ManyToOne(() => Site, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'import_run_site_id_fkey' })
  site?: Site;

  @Column({ type: 'uuid', name: 'user_id' })
  userId: string;

  @ManyToOne(() => User)
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'import_run_user_id_fkey' })
  user?: User;

  @Column({ type: 'varchar', length: 40 })
  kind: string;

  @Column({ type: 'varchar', name: 'file_name', length: 255 })
  fileName: string;

  @Column({ type: 'varchar', length: 10, default: 'reading' })
  status: ImportRunStatus;

  @Column({ type: 'integer', name: 'rows_total', default: 0 })
  rowsTotal: number;

  @Column({ type: 'integer', name: 'rows_done', default: 0 })
  rowsDone: number;

  @Column({ type: 'text', nullable: true })
  message: string | null;

  @Column({ type: 'timestamptz', name: 'started_at', default: () => 'now()' })
  startedAt: Date;

  @Column({ type: 'timestamptz', name: 'finished_at', nullable: true })
  finishedAt: Date | null;
}
