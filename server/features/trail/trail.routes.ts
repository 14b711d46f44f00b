import { can } from '../../contracts/permissions.js';
import { Router } from 'express';
import { queryPage } from '../../db/page.js';
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
    const seesSiteless = can(user.role, 'trail.read-siteless');
    res.json(await queryPage(dataSource, {
      select: 'SELECT * FROM trail_entry',
      countFrom: 'FROM trail_entry',
      where: `(site_id = ANY($1::uuid[]) OR (site_id IS NULL AND $2))
        AND ($3::text IS NULL OR entity = $3) AND ($4::uuid IS NULL OR site_id = $4)`,
      order: `occurred_at ${query.sortDesc === false && query.sortBy === 'occurredAt' ? 'ASC' : 'DESC'}, id DESC`,
      params: [user.siteIds, seesSiteless, query.entity ?? null, query.siteId ?? null],
    }, query, (row: TrailRow): TrailEntryView => ({
      id: String(row.id),
      occurredAt: row.occurred_at.toISOString(),
      actorEmail: row.actor_email,
      action: row.action,
      entity: row.entity,
      entityId: row.entity_id,
      siteId: row.site_id,
      before: row.before,
      after: row.after,
    })));
  });

  return router;
}
