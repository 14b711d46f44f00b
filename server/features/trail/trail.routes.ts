import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { TrailQuery, type TrailEntryView } from '../../contracts/trail.js';
import { currentUser } from '../../auth/current-user.js';
import { requirePermission } from '../../middleware/require-permission.js';
import { validate } from '../../middleware/validate.js';

interface TrailRow {
  id: string;
  occurred_at: Date;
  actor_email: string | null;
  action: string;
  entity: string;
  entity_id: string;
  site_id: string | null;
  before: unknown;
  after: unknown;
}

export function trailRoutes(dataSource: DataSource): Router {
  const router = Router();

  router.get('/', requirePermission('trail.read'), validate({ query: TrailQuery }), async (_req, res) => {
    const user = currentUser(res);
    const query = res.locals.query as TrailQuery;
    // Entries of a site: whoever may see the site. Entries of no site (people, sign-ins):
    // administrators and auditors.
    const seesSiteless = user.role === 'administrator' || user.role === 'auditor';
    const params = [user.siteIds, seesSiteless, query.entity ?? null, query.siteId ?? null];
    const where = `(site_id = ANY($1::uuid[]) OR (site_id IS NULL AND $2))
      AND ($3::text IS NULL OR entity = $3) AND ($4::uuid IS NULL OR site_id = $4)`;
    const rows: TrailRow[] = await dataSource.query(
      `SELECT * FROM trail_entry WHERE ${where} ORDER BY occurred_at ${query.sortDesc === false && query.sortBy === 'occurredAt' ? 'ASC' : 'DESC'}, id DESC
        LIMIT $5 OFFSET $6`,
      [...params, query.pageSize, (query.page - 1) * query.pageSize],
    );
    const [{ count }] = await dataSource.query(`SELECT count(*)::int AS count FROM trail_entry WHERE ${where}`, params);
    const items: TrailEntryView[] = rows.map((row) => ({
      id: String(row.id),
      occurredAt: row.occurred_at.toISOString(),
      actorEmail: row.actor_email,
      action: row.action,
      entity: row.entity,
      entityId: row.entity_id,
      siteId: row.site_id,
      before: row.before,
      after: row.after,
    }));
    res.json({ items, total: count, page: query.page, pageSize: query.pageSize });
  });

  return router;
}
