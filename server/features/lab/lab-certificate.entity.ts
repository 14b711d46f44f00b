import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { Flag } from '../../contracts/flags.js';
import { Site } from '../../kernel/sites/site.entity.js';
import { StoredFile } from '../../kernel/files/stored-file.entity.js';
import { User } from '../../kernel/people/user.entity.js';

// Unique by site and the compared form of lab and report number: an expression index (migration DocumentKeys).
@Index('UQ_lab_certificate_report', { synchronize: false })
@Index('IDX_lab_certificate_site_received', ['siteId', 'receivedOn'])
@Entity('lab_certificate')
export class LabCertificate {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'site_id' })
  siteId: string;

  @ManyToOne(() => Site, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'lab_certificate_site_id_fkey' })
  site?: Site;

  @Column({ type: 'varchar', name: 'lab_name', length: 200 })
  labName: string;

  @Column({ type: 'varchar', name: 'lab_accreditation_number', length: 60 })
  labAccreditationNumber: string;

  @Column({ type: 'varchar', name: 'report_number', length: 60 })
  reportNumber: string;

  @Column({ type: 'date', name: 'received_on' })
  receivedOn: string;

  /** The site's local time of day the certificate arrived; the site became aware of its results then. */
  @Column({ type: 'time', name: 'received_time', precision: 0, nullable: true })
  receivedTime: string | null;

  @Column({ type: 'uuid', name: 'file_id', nullable: true })
  fileId: string | null;

  @ManyToOne(() => StoredFile, { onDelete: 'NO ACTION' })
  @JoinColumn({ name: 'file_id', foreignKeyConstraintName: 'lab_certificate_file_id_fkey' })
  file?: StoredFile;

  @Column({ type: 'jsonb', default: '[]' })
  flags: Flag[];

  @Column({ type: 'uuid', name: 'created_by', nullable: true })
  createdBy: string | null;

  @ManyToOne(() => User, { onDelete: 'NO ACTION' })
  @JoinColumn({ name: 'created_by', foreignKeyConstraintName: 'lab_certificate_created_by_fkey' })
  createdByRef?: User;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
