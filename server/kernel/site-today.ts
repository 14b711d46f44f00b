import { DateTime } from 'luxon';
import type { DataSource, EntityManager } from 'typeorm';

/** Today's date at the site (its IANA zone), as YYYY-MM-DD. */
export async function siteToday(db: DataSource | EntityManager, siteId: string, now = new Date()): Promise<string> {
  const [site] = await db.query('SELECT time_zone FROM site WHERE id = $1', [siteId]);
  return DateTime.fromJSDate(now, { zone: site?.time_zone ?? 'UTC' }).toISODate()!;
}
