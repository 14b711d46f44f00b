import type { DataSource } from 'typeorm';
import type { Role } from '../../contracts/permissions.js';
import { User } from '../../kernel/people/user.entity.js';

/** The role of an active person, or null when there is no such active person. */
export async function findActiveRole(db: DataSource, userId: string): Promise<{ role: Role | null } | null> {
  return db.getRepository(User).findOne({ where: { id: userId, active: true }, select: { role: true } });
}
