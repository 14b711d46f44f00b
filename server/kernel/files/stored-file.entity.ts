import { Check, Column, Index, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from '../people/user.entity.js';
import { Site } from '../sites/site.entity.js';

@Check('stored_file_size_bytes_check', `(size_bytes > 0)`)
@Check(
  'stored_file_purpose_check',
  `((purpose)::text = ANY ((ARRAY['certificate'::character varying, 'signed-copy'::character varying, 'follow-up-evidence'::character varying, 'upkeep-photo'::character varying])::text[]))`,
)
@Check('stored_file_owner_check', `((owner_entity IS NULL) = (owner_id IS NULL))`)
@Index('IDX_stored_file_owner', ['ownerEntity', 'ownerId'])
/** A file belongs to a site and, once claimed, to one record (owner), for good. */
@Entity('stored_file')
export class StoredFile {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'char', length: 64 })
  sha256: string;

  @Column({ type: 'varchar', name: 'file_name', length: 255 })
  fileName: string;

  @Column({ type: 'varchar', name: 'media_type', length: 100 })
  mediaType: string;

  @Column({ type: 'integer', name: 'size_bytes' })
  sizeBytes: number;

  @Column({ type: 'bytea' })
  content: Buffer;

  @Column({ type: 'uuid', name: 'uploaded_by', nullable: true })
  uploadedBy: string | null;

  @ManyToOne(() => User, { onDelete: 'NO ACTION' })
  @JoinColumn({ name: 'uploaded_by', foreignKeyConstraintName: 'stored_file_uploaded_by_fkey' })
  uploadedByRef?: User;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @Column({ type: 'uuid', name: 'site_id' })
  siteId: string;

  @ManyToOne(() => Site, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'stored_file_site_id_fkey' })
  site?: Site;

  @Column({ type: 'varchar', length: 30 })
  purpose: string;

  @Column({ type: 'varchar', name: 'owner_entity', length: 40, nullable: true })
  ownerEntity: string | null;

  @Column({ type: 'uuid', name: 'owner_id', nullable: true })
  ownerId: string | null;
}
