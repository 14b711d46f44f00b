import { DateTime } from 'luxon';
import type { DataSource, EntityManager } from 'typeorm';

/** A site's IANA time zone (UTC when the site is not found). */
export async function siteZone(db: DataSource | EntityManager, siteId: string): Promise<string> {
  const [site] = await db.query('SELECT time_zone FROM site WHERE id = $1', [siteId]);
  return site?.time_zone ?? 'UTC';
}

/** Today's date at the site (its IANA zone), as YYYY-MM-DD. */
export async function siteToday(db: DataSource | EntityManager, siteId: string, now = new Date()): Promise<string> {
  return DateTime.fromJSDate(now, { zone: await siteZone(db, siteId) }).toISODate()!;
}
