import { Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { Site } from '../sites/site.entity.js';
import { User } from './user.entity.js';

@Index('IDX_user_site_site', ['siteId'])
@Entity('user_site')
export class UserSite {
  @PrimaryColumn({ type: 'uuid', name: 'user_id' })
  userId: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'user_site_user_id_fkey' })
  user?: User;

  @PrimaryColumn({ type: 'uuid', name: 'site_id' })
  siteId: string;

  @ManyToOne(() => Site, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'user_site_site_id_fkey' })
  site?: Site;
}
