import type { DataSource, EntityManager } from 'typeorm';
import type { Role } from '../../contracts/permissions.js';

export interface Recipient {
  id: string;
  email: string;
  name: string;
  role: Role | null;
}

/** The active people of these roles who work at a site. */
export function siteRecipients(db: DataSource | EntityManager, siteId: string, roles: Role[]): Promise<Recipient[]> {
  return db.query(
    `SELECT u.id, u.email, u.name, u.role FROM app_user u JOIN user_site us ON us.user_id = u.id
      WHERE us.site_id = $1 AND u.active AND u.role = ANY($2::text[]) ORDER BY u.email`,
    [siteId, roles],
  );
}
