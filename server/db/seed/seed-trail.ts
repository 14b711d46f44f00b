import type { EntityManager } from 'typeorm';

/** How the trail names the seed as the actor of what it created. */
export const seedActor = 'demo seed';

/**
 * Each table the demo seed fills, the trail's name for its records, and the SQL that picks the
 * seed's rows (those of the demo sites) with their site. `$1` is the demo sites' ids.
 */
const seededRecords: Array<{ entity: string; rows: string }> = [
  { entity: 'site', rows: 'SELECT s.id::text AS id, s.id AS site_id, to_jsonb(s) AS after FROM site s WHERE s.id = ANY($1)' },
  {
    entity: 'user',
    rows: `SELECT u.id::text, NULL::uuid, to_jsonb(u) FROM app_user u
            WHERE u.id IN (SELECT user_id FROM user_site WHERE site_id = ANY($1))
              AND NOT EXISTS (SELECT 1 FROM user_site other WHERE other.user_id = u.id AND other.site_id <> ALL($1))`,
  },
  { entity: 'discharge-point', rows: 'SELECT d.id::text, d.site_id, to_jsonb(d) FROM discharge_point d WHERE d.site_id = ANY($1)' },
  { entity: 'permit', rows: 'SELECT p.id::text, p.site_id, to_jsonb(p) FROM permit p WHERE p.site_id = ANY($1)' },
  {
    entity: 'permit-settings',
    rows: 'SELECT v.id::text, p.site_id, to_jsonb(v) FROM permit_settings v JOIN permit p ON p.id = v.permit_id WHERE p.site_id = ANY($1)',
  },
  {
    entity: 'limit',
    rows: 'SELECT l.id::text, p.site_id, to_jsonb(l) FROM permit_limit l JOIN permit p ON p.id = l.permit_id WHERE p.site_id = ANY($1)',
  },
  {
    entity: 'reporting-period',
    rows: `SELECT r.id::text, p.site_id, to_jsonb(r) FROM reporting_period r JOIN permit p ON p.id = r.permit_id WHERE p.site_id = ANY($1)`,
  },
  { entity: 'lab-certificate', rows: 'SELECT c.id::text, c.site_id, to_jsonb(c) FROM lab_certificate c WHERE c.site_id = ANY($1)' },
  {
    entity: 'flow-reading',
    rows: `SELECT f.id::text, d.site_id, to_jsonb(f) FROM flow_reading f JOIN discharge_point d ON d.id = f.discharge_point_id
            WHERE d.site_id = ANY($1)`,
  },
  { entity: 'equipment', rows: 'SELECT e.id::text, e.site_id, to_jsonb(e) FROM equipment e WHERE e.site_id = ANY($1)' },
  { entity: 'oil-log-entry', rows: 'SELECT o.id::text, o.site_id, to_jsonb(o) FROM oil_log_entry o WHERE o.site_id = ANY($1)' },
  { entity: 'upkeep-check', rows: 'SELECT k.id::text, k.site_id, to_jsonb(k) FROM upkeep_check k WHERE k.site_id = ANY($1)' },
  { entity: 'shipment', rows: 'SELECT s.id::text, s.site_id, to_jsonb(s) FROM shipment s WHERE s.site_id = ANY($1)' },
  { entity: 'follow-up', rows: 'SELECT f.id::text, f.site_id, to_jsonb(f) FROM follow_up f WHERE f.site_id = ANY($1)' },
];

/**
 * Writes one 'create' trail entry, by the seed, for every record the seed made at the demo sites,
 * with the record as it stands. Runs in the seed's transaction, after everything else.
 */
export async function recordSeedInTrail(manager: EntityManager, demoSiteIds: string[]): Promise<number> {
  let written = 0;
  for (const { entity, rows } of seededRecords) {
    // Raw SQL: one INSERT … SELECT per table writes thousands of entries without a round trip each.
    const inserted: unknown[] = await manager.query(
      `INSERT INTO trail_entry (actor_id, actor_email, action, entity, entity_id, site_id, before, after)
       SELECT NULL, '${seedActor}', 'create', '${entity}', seeded.id, seeded.site_id, NULL, seeded.after
         FROM (${rows}) AS seeded(id, site_id, after)
       RETURNING id`,
      [demoSiteIds],
    );
    written += inserted.length;
  }
  return written;
}
