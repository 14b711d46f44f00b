import type { EntityManager } from 'typeorm';
import type { MailKind } from '../../contracts/mail.js';
import { deliveriesFor } from './mail-preferences.js';
import type { Recipient } from './recipients.js';

/** What a mail says, written when the event happens; the deliverer adds the link's host and the way out. */
export interface MailContent {
  subject: string;
  /** Paragraphs of plain text. */
  lines: string[];
  /** The record's place in the app, from the root ("/follow-ups?…"). */
  path: string;
  linkText: string;
  /** Stored files sent along (a notice's PDF). */
  attachments?: Array<{ fileId: string; fileName: string }>;
}

export interface MailEvent {
  /** One mail per event and recipient: the same key twice queues nothing more. */
  eventKey: string;
  kind: MailKind;
  content: MailContent;
  followUpId?: string;
}

/**
 * Queues a mail to each recipient who takes this kind at once, inside the caller's transaction:
 * if the change rolls back, so does its mail. Returns how many were queued.
 */
export async function queueMail(manager: EntityManager, event: MailEvent, recipients: Recipient[]): Promise<number> {
  const deliveries = await deliveriesFor(manager, recipients, event.kind);
  const now = recipients.filter((r) => deliveries.get(r.id) === 'now');
  if (now.length === 0) return 0;
  const rows: Array<{ id: string }> = await manager.query(
    `INSERT INTO mail_outbox (event_key, kind, user_id, recipient, params, subject, follow_up_id)
     SELECT $1, $2, r.id, r.email, $3, $4, $5 FROM unnest($6::uuid[], $7::text[]) AS r(id, email)
     ON CONFLICT (event_key, recipient) DO NOTHING RETURNING id`,
    [
      event.eventKey,
      event.kind,
      JSON.stringify(event.content),
      event.content.subject.slice(0, 300),
      event.followUpId ?? null,
      now.map((r) => r.id),
      now.map((r) => r.email),
    ],
  );
  return rows.length;
}

/**
 * Queues a mail to an address outside Decant (the control authority), inside the caller's
 * transaction; such a mail carries no link back into the app and no unsubscribe link.
 */
export async function queueMailTo(manager: EntityManager, event: MailEvent, address: string): Promise<number> {
  const rows: Array<{ id: string }> = await manager.query(
    `INSERT INTO mail_outbox (event_key, kind, user_id, recipient, params, subject, follow_up_id)
     VALUES ($1, $2, NULL, $3, $4, $5, $6) ON CONFLICT (event_key, recipient) DO NOTHING RETURNING id`,
    [event.eventKey, event.kind, address, JSON.stringify(event.content), event.content.subject.slice(0, 300), event.followUpId ?? null],
  );
  return rows.length;
}
