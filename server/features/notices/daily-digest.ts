import { DateTime } from 'luxon';
import type { DataSource } from 'typeorm';
import { queueMail } from '../../kernel/mail/outbox.js';
import type { Recipient } from '../../kernel/mail/recipients.js';
import { localTime } from './follow-up-mail.js';

interface DigestItem {
  user_id: string;
  site_name: string;
  time_zone: string;
  title: string;
  due_at: Date;
}

/** The local hour the digest goes out at; the job runs hourly and picks the people whose morning it is. */
export const DIGEST_HOUR = 7;

/**
 * One mail a day per person who takes the digest: the open follow-ups at their sites that are
 * overdue or due within 7 days, overdue first. Nobody gets an empty digest.
 */
export async function queueDailyDigests(db: DataSource, now = new Date()): Promise<number> {
  return db.transaction(async (manager) => {
    // Each person's morning is that of their first site (by name): the digest goes out at 07:00 there.
    const people: Array<Recipient & { time_zone: string }> = await manager.query(
      `SELECT DISTINCT ON (u.id) u.id, u.email, u.name, u.role, s.time_zone
         FROM app_user u JOIN user_site us ON us.user_id = u.id JOIN site s ON s.id = us.site_id
        WHERE u.active AND u.role IS NOT NULL ORDER BY u.id, s.name`,
    );
    const items: DigestItem[] = await manager.query(
      `SELECT us.user_id, s.name AS site_name, s.time_zone, f.title, f.due_at
         FROM follow_up f JOIN site s ON s.id = f.site_id JOIN user_site us ON us.site_id = f.site_id
        WHERE f.status = 'open' AND f.due_at <= $1::timestamptz + interval '7 days'
        ORDER BY f.due_at`,
      [now],
    );
    let queued = 0;
    for (const person of people) {
      const local = DateTime.fromJSDate(now, { zone: person.time_zone });
      if (local.hour !== DIGEST_HOUR) continue;
      const day = local.toISODate();
      const mine = items.filter((item) => item.user_id === person.id);
      if (mine.length === 0) continue;
      const overdue = mine.filter((item) => item.due_at.getTime() < now.getTime());
      const soon = mine.filter((item) => item.due_at.getTime() >= now.getTime());
      const line = (item: DigestItem) => `• ${item.title} — ${item.site_name}, due ${localTime(item.due_at, item.time_zone)}`;
      queued += await queueMail(
        manager,
        {
          eventKey: `digest:${person.id}:${day}`,
          kind: 'digest',
          content: {
            subject: `Decant: ${overdue.length} overdue, ${soon.length} due within 7 days`,
            lines: [
              `Good morning ${person.name}. At your sites:`,
              ...(overdue.length ? ['Overdue:', ...overdue.map(line)] : []),
              ...(soon.length ? ['Due within 7 days:', ...soon.map(line)] : []),
            ],
            path: '/follow-ups',
            linkText: 'Open the follow-ups',
          },
        },
        [person],
      );
    }
    return queued;
  });
}
