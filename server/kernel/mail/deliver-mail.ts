import type { Transporter } from 'nodemailer';
import type { DataSource, EntityManager } from 'typeorm';
import type { MailKind } from '../../contracts/mail.js';
import type { MailContent } from './outbox.js';
import { renderMail } from './render-mail.js';
import { unsubscribeToken } from './unsubscribe-token.js';

export interface MailSettings {
  transport: Transporter;
  from: string;
  appUrl: string;
  secret: string;
}

/** After this many refusals a mail is given up and shown as not delivered on its follow-up. */
export const MAX_ATTEMPTS = 8;
/** 30 s, 1 min, 2 min, … up to 6 hours between attempts. */
export const retryDelaySeconds = (attempts: number) => Math.min(30 * 2 ** (attempts - 1), 6 * 3600);

interface Claimed {
  id: string;
  kind: MailKind;
  user_id: string | null;
  recipient: string;
  params: MailContent;
  attempts: number;
}

/**
 * Sends what is due in the outbox, one mail per short transaction: the row is claimed with
 * FOR UPDATE SKIP LOCKED, so several instances delivering at once never send the same mail
 * twice, and a mail is marked sent only once the SMTP server took it (a crash in between sends it
 * again: at least once, never lost). A refusal schedules the next attempt with backoff.
 */
export async function deliverPendingMail(db: DataSource, settings: MailSettings, limit = 200): Promise<{ sent: number; failed: number }> {
  let sent = 0;
  let failed = 0;
  // Reminders of follow-ups closed since they were queued would be wrong by now: dropped, not sent.
  await db.query(
    `UPDATE mail_outbox m SET status = 'dropped' FROM follow_up f
      WHERE m.status = 'pending' AND m.follow_up_id = f.id AND f.status <> 'open' AND m.event_key LIKE 'reminder:%'`,
  );
  for (let i = 0; i < limit; i++) {
    const outcome = await db.transaction(async (manager) => {
      const [mail]: Claimed[] = await manager.query(
        `SELECT id, kind, user_id, recipient, params, attempts FROM mail_outbox
          WHERE status = 'pending' AND next_attempt_at <= now() ORDER BY next_attempt_at LIMIT 1 FOR UPDATE SKIP LOCKED`,
      );
      if (!mail) return 'empty' as const;
      // A person of Decant gets the record's link and the way out; an outside address neither.
      const unsubscribe = mail.user_id
        ? `${settings.appUrl}/api/mail/unsubscribe?token=${unsubscribeToken(mail.user_id, mail.kind, settings.secret)}`
        : null;
      const message = renderMail(
        mail.params,
        mail.kind,
        unsubscribe ? { record: `${settings.appUrl}${mail.params.path}`, unsubscribe } : null,
      );
      const attachments = await attachmentsOf(manager, mail.params);
      try {
        await settings.transport.sendMail({
          from: settings.from,
          to: mail.recipient,
          ...message,
          attachments,
          headers: unsubscribe ? { 'List-Unsubscribe': `<${unsubscribe}>`, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' } : {},
        });
        await manager.query(
          `UPDATE mail_outbox SET status = 'sent', sent_at = now(), attempts = attempts + 1, last_error = NULL WHERE id = $1`,
          [mail.id],
        );
        return 'sent' as const;
      } catch (error) {
        const attempts = mail.attempts + 1;
        await manager.query(
          `UPDATE mail_outbox SET attempts = $2, last_error = $3, status = $4, next_attempt_at = now() + make_interval(secs => $5) WHERE id = $1`,
          [
            mail.id,
            attempts,
            String((error as Error).message ?? error).slice(0, 500),
            attempts >= MAX_ATTEMPTS ? 'failed' : 'pending',
            retryDelaySeconds(attempts),
          ],
        );
        return 'refused' as const;
      }
    });
    if (outcome === 'empty') break;
    if (outcome === 'sent') sent++;
    else failed++;
    // An SMTP server that refused one mail is likely down: leave the rest for the next run.
    if (outcome === 'refused') break;
  }
  return { sent, failed };
}

async function attachmentsOf(manager: EntityManager, content: MailContent) {
  if (!content.attachments?.length) return [];
  const files: Array<{ id: string; content: Buffer; media_type: string }> = await manager.query(
    `SELECT id, content, media_type FROM stored_file WHERE id = ANY($1::uuid[])`,
    [content.attachments.map((a) => a.fileId)],
  );
  return content.attachments.flatMap((a) => {
    const file = files.find((f) => f.id === a.fileId);
    return file ? [{ filename: a.fileName, content: file.content, contentType: file.media_type }] : [];
  });
}
