import type { EntityManager } from 'typeorm';
import type { MailKind } from '../../contracts/mail.js';
import { siteDateTime } from '../../contracts/site-time.js';
import type { Role } from '../../contracts/permissions.js';
import { queueMail } from '../../kernel/mail/outbox.js';
import { siteRecipients } from '../../kernel/mail/recipients.js';

/** Which kind of mail a follow-up's notices are, and who besides coordinators gets them. */
export function mailKindOf(followUpKind: string): { kind: MailKind; roles: Role[] } {
  switch (followUpKind) {
    case 'notify-control-authority':
    case 'report-within-24-hours':
    case 'repeat-sampling':
    case 'written-report':
      return { kind: 'violation', roles: ['coordinator'] };
    case 'contact-transporter-and-facility':
    case 'exception-report':
    case 'copy-with-note-of-non-receipt':
      return { kind: 'shipment-copy', roles: ['coordinator'] };
    case 'upkeep-due':
      return { kind: 'upkeep', roles: ['coordinator', 'operator'] };
    case 'report-due':
      return { kind: 'report-due', roles: ['coordinator'] };
    default:
      return { kind: 'deadline', roles: ['coordinator'] };
  }
}

/** Follow-ups whose opening is itself news: a violation's hours-long clock, a signed copy overdue. */
const mailedOnOpening = new Set([
  'notify-control-authority',
  'report-within-24-hours',
  'contact-transporter-and-facility',
  'exception-report',
  'copy-with-note-of-non-receipt',
  'upkeep-due',
]);

export interface OpenedFollowUp {
  id: string;
  siteId: string;
  kind: string;
  title: string;
  dueAt: Date;
}

const followUpPath = (siteId: string) => `/follow-ups?siteId=${siteId}`;

/** Mails the site's people about a follow-up just opened, when its kind is news at once. */
export async function mailFollowUpOpened(manager: EntityManager, followUp: OpenedFollowUp): Promise<void> {
  if (!mailedOnOpening.has(followUp.kind)) return;
  const { kind, roles } = mailKindOf(followUp.kind);
  const [site] = await manager.query(`SELECT name, time_zone FROM site WHERE id = $1`, [followUp.siteId]);
  const due = localTime(followUp.dueAt, site.time_zone);
  const lines =
    kind === 'violation'
      ? [
          `A result at ${site.name} is over its permit limit. ${followUp.title}.`,
          `Due ${due} (site time). The clock runs from when the site became aware of the result; check the permit and the control authority's instructions for how to notify.`,
        ]
      : [`${followUp.title}.`, `At ${site.name}; due ${due} (site time).`];
  await queueMail(
    manager,
    {
      eventKey: `opened:${followUp.id}`,
      kind,
      followUpId: followUp.id,
      content: {
        subject: `${kind === 'violation' ? 'Violation' : 'To do'} at ${site.name}: ${followUp.title}`.slice(0, 300),
        lines,
        path: followUpPath(followUp.siteId),
        linkText: 'Open the follow-ups',
      },
    },
    await siteRecipients(manager, followUp.siteId, roles),
  );
}

/** A moment as "YYYY-MM-DD HH:MM" in a time zone: the app's one date format (contracts/site-time.ts). */
export const localTime = (at: Date, timeZone: string) => siteDateTime(at, timeZone);

export { followUpPath };
