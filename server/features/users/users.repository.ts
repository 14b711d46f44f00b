import { In, type DataSource, type EntityManager } from 'typeorm';
import { UserSite } from '../../kernel/people/user-site.entity.js';
import { Site } from '../../kernel/sites/site.entity.js';
import type { Page } from '../../contracts/paging.js';
import type { UserListQuery, UserView } from '../../contracts/users.js';

const sortColumns: Record<UserListQuery['sortBy'] & string, string> = {
  email: 'u.email',
  name: 'u.name',
  role: 'u.role',
  lastSignInAt: 'u.last_sign_in_at',
  createdAt: 'u.created_at',
};

interface UserRow {
  id: string;
  email: string;
  name: string;
  role: UserView['role'];
  active: boolean;
  site_ids: string[];
  last_sign_in_at: Date | null;
  created_at: Date;
  total?: string;
}

const toView = (row: UserRow): UserView => ({
  id: row.id,
  email: row.email,
  name: row.name,
  role: row.role,
  active: row.active,
  siteIds: row.site_ids,
  lastSignInAt: row.last_sign_in_at?.toISOString() ?? null,
  createdAt: row.created_at.toISOString(),
});

// Raw SQL: one statement aggregates each person's sites beside the page of people.
const selectUsers = `
  SELECT u.id, u.email, u.name, u.role, u.active, u.last_sign_in_at, u.created_at,
         coalesce(array_agg(us.site_id ORDER BY us.site_id) FILTER (WHERE us.site_id IS NOT NULL), '{}') AS site_ids
    FROM app_user u LEFT JOIN user_site us ON us.user_id = u.id`;

export async function pageUsers(dataSource: DataSource, query: UserListQuery): Promise<Page<UserView>> {
  const sort = query.sortBy ? sortColumns[query.sortBy] : 'u.email';
  const direction = query.sortDesc ? 'DESC NULLS LAST' : 'ASC NULLS FIRST';
  const search = query.search ? `%${query.search.replace(/[\\%_]/g, '\\$&')}%` : null;
  const rows: UserRow[] = await dataSource.query(
    `${selectUsers}
      WHERE ($1::text IS NULL OR u.email ILIKE $1 OR u.name ILIKE $1)
      GROUP BY u.id
      ORDER BY ${sort} ${direction}, u.id
      LIMIT $2 OFFSET $3`,
    [search, query.pageSize, (query.page - 1) * query.pageSize],
  );
  const [{ count }] = await dataSource.query(
    `SELECT count(*)::int AS count FROM app_user u WHERE ($1::text IS NULL OR u.email ILIKE $1 OR u.name ILIKE $1)`,
    [search],
  );
  return { items: rows.map(toView), total: count, page: query.page, pageSize: query.pageSize };
}

export async function findUserView(manager: EntityManager | DataSource, id: string): Promise<UserView | null> {
  const rows: UserRow[] = await manager.query(`${selectUsers} WHERE u.id = $1 GROUP BY u.id`, [id]);
  return rows[0] ? toView(rows[0]) : null;
}

export async function replaceUserSites(manager: EntityManager, userId: string, siteIds: string[]): Promise<void> {
  await manager.delete(UserSite, { userId });
  if (siteIds.length > 0)
    await manager.insert(
      UserSite,
      [...new Set(siteIds)].map((siteId) => ({ userId, siteId })),
    );
}

export async function countExistingSites(manager: EntityManager, siteIds: string[]): Promise<number> {
  return manager.countBy(Site, { id: In([...new Set(siteIds)]) });
}
