import type { DataSource, EntityManager } from 'typeorm';
import { queueMail } from '../../kernel/mail/outbox.js';
import { findPeriod } from '../periods/periods.repository.js';
import { openSiteDeadlines } from '../periods/periods.service.js';
import { siteRecipients } from '../../kernel/mail/recipients.js';
import { followUpPath, localTime, mailKindOf } from './follow-up-mail.js';

const HOUR = 3600_000;
const DAY = 24 * HOUR;

export interface ReminderPoint {
  key: 'day-before' | 'within-the-hour' | '7-days' | '1-day' | 'overdue';
  at: Date;
}

/**
 * When a follow-up's reminders fall: for deadlines counted in hours (24-hour notices), a day
 * before and within the hour of the deadline; for those counted in days (30-day resampling, a
 * manifest's 45 / 60 days), 7 days and 1 day before; for all, when it becomes overdue. Points
 * that fall before the follow-up was opened (its opening mail said as much) are left out.
 */
export function reminderPoints(openedAt: Date, dueAt: Date): ReminderPoint[] {
  const due = dueAt.getTime();
  const hourScale = due - openedAt.getTime() <= 72 * HOUR;
  const points: ReminderPoint[] = hourScale
    ? [
        { key: 'day-before', at: new Date(due - DAY) },
        { key: 'within-the-hour', at: new Date(due - HOUR) },
      ]
    : [
        { key: '7-days', at: new Date(due - 7 * DAY) },
        { key: '1-day', at: new Date(due - DAY) },
      ];
  points.push({ key: 'overdue', at: dueAt });
  return points.filter((point) => point.at.getTime() > openedAt.getTime() + 5 * 60_000);
}

/** The latest reminder point already reached, if any: a sweep that ran late sends one, not a backlog. */
export function dueReminder(openedAt: Date, dueAt: Date, now: Date): ReminderPoint | null {
  const reached = reminderPoints(openedAt, dueAt).filter((point) => point.at.getTime() <= now.getTime());
  return reached.at(-1) ?? null;
}

const reminderWords: Record<ReminderPoint['key'], string> = {
  'day-before': 'due within a day',
  'within-the-hour': 'due within the hour',
  '7-days': 'due in 7 days',
  '1-day': 'due tomorrow',
  overdue: 'overdue',
};

interface OpenFollowUpRow {
  id: string;
  site_id: string;
  site_name: string;
  time_zone: string;
  kind: string;
  title: string;
  due_at: Date;
  created_at: Date;
}

/**
 * Opens the deadlines that come from the calendar rather than from a compile (a signed copy not
 * back, an upkeep check overdue, a report due within 7 days) for each permit's running period,
 * then queues the reminders now due and the report-due notices (14 and 3 days before).
 */
export async function sweepDeadlines(db: DataSource, now = new Date()): Promise<number> {
  await db.transaction(async (manager) => {
    const running: Array<{ id: string }> = await manager.query(
      `SELECT rp.id FROM reporting_period rp JOIN permit p ON p.id = rp.permit_id JOIN site s ON s.id = p.site_id
        WHERE ($1::timestamptz AT TIME ZONE s.time_zone)::date BETWEEN rp.starts_on AND rp.ends_on`,
      [now],
    );
    for (const { id } of running) {
      const period = await findPeriod(manager, id);
      if (period) await openSiteDeadlines(manager, period);
    }
  });
  return db.transaction(async (manager) => (await remindFollowUps(manager, now)) + (await remindReportsDue(manager, now)));
}

async function remindFollowUps(manager: EntityManager, now: Date): Promise<number> {
  const rows: OpenFollowUpRow[] = await manager.query(
    `SELECT f.id, f.site_id, s.name AS site_name, s.time_zone, f.kind, f.title, f.due_at, f.created_at
       FROM follow_up f JOIN site s ON s.id = f.site_id
      WHERE f.status = 'open' AND f.due_at <= $1::timestamptz + interval '7 days'`,
    [now],
  );
  let queued = 0;
  for (const row of rows) {
    const point = dueReminder(row.created_at, row.due_at, now);
    if (!point) continue;
    const { kind, roles } = mailKindOf(row.kind);
    const words = reminderWords[point.key];
    queued += await queueMail(
      manager,
      {
        eventKey: `reminder:${row.id}:${point.key}`,
        kind: kind === 'violation' || kind === 'upkeep' || kind === 'shipment-copy' ? kind : 'deadline',
        followUpId: row.id,
        content: {
          subject: `${point.key === 'overdue' ? 'Overdue' : 'Reminder'} at ${row.site_name}: ${row.title}`.slice(0, 300),
          lines: [`${row.title}: ${words}.`, `At ${row.site_name}; due ${localTime(row.due_at, row.time_zone)} (site time).`],
          path: followUpPath(row.site_id),
          linkText: 'Open the follow-ups',
        },
      },
      await siteRecipients(manager, row.site_id, roles),
    );
  }
  return queued;
}

async function remindReportsDue(manager: EntityManager, now: Date): Promise<number> {
  const periods: Array<{
    id: string;
    site_id: string;
    site_name: string;
    starts_on: string;
    ends_on: string;
    due_on: string;
    days_left: number;
    number: string;
  }> = await manager.query(
    `SELECT rp.id, p.site_id, s.name AS site_name, rp.starts_on::text, rp.ends_on::text, rp.due_on::text, p.number,
              rp.due_on - ($1::timestamptz AT TIME ZONE s.time_zone)::date AS days_left
         FROM reporting_period rp JOIN permit p ON p.id = rp.permit_id JOIN site s ON s.id = p.site_id
        WHERE rp.status NOT IN ('signed') AND rp.submitted_on IS NULL
          AND rp.due_on - ($1::timestamptz AT TIME ZONE s.time_zone)::date BETWEEN 0 AND 14
          AND rp.ends_on < ($1::timestamptz AT TIME ZONE s.time_zone)::date`,
    [now],
  );
  let queued = 0;
  for (const period of periods) {
    const point = period.days_left <= 3 ? '3-days' : '14-days';
    queued += await queueMail(
      manager,
      {
        eventKey: `report-due:${period.id}:${point}`,
        kind: 'report-due',
        content: {
          subject: `Periodic report due ${period.due_on}: ${period.site_name}, permit ${period.number}`,
          lines: [
            `The periodic report for ${period.starts_on} – ${period.ends_on} (permit ${period.number}, ${period.site_name}) is due ${period.due_on}: ${period.days_left} day(s) left.`,
            'Compile the period, review it and sign it; the permit and the control authority say how the report is to be sent.',
          ],
          path: `/periods/${period.id}`,
          linkText: 'Open the period',
        },
      },
      await siteRecipients(manager, period.site_id, ['coordinator']),
    );
  }
  return queued;
}
