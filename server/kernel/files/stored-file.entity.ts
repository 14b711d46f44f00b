import { Check, Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from '../people/user.entity.js';

@Check('stored_file_size_bytes_check', `(size_bytes > 0)`)
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
}
