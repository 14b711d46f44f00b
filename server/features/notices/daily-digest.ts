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

/**
 * One mail a day per person who takes the digest: the open follow-ups at their sites that are
 * overdue or due within 7 days, overdue first. Nobody gets an empty digest.
 */
export async function queueDailyDigests(db: DataSource, now = new Date()): Promise<number> {
  return db.transaction(async (manager) => {
    const people: Recipient[] = await manager.query(`SELECT id, email, name, role FROM app_user WHERE active AND role IS NOT NULL`);
    const items: DigestItem[] = await manager.query(
      `SELECT us.user_id, s.name AS site_name, s.time_zone, f.title, f.due_at
         FROM follow_up f JOIN site s ON s.id = f.site_id JOIN user_site us ON us.site_id = f.site_id
        WHERE f.status = 'open' AND f.due_at <= $1::timestamptz + interval '7 days'
        ORDER BY f.due_at`,
      [now],
    );
    const day = now.toISOString().slice(0, 10);
    let queued = 0;
    for (const person of people) {
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
