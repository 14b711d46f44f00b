import type { EntityManager } from 'typeorm';
import { queueMail } from '../../kernel/mail/outbox.js';
import { siteRecipients } from '../../kernel/mail/recipients.js';

/** Tells the site's auditors (and its coordinators) that a period was signed, with its pack. */
export async function mailPeriodSigned(
  manager: EntityManager,
  period: { id: string; siteId: string; startsOn: string; endsOn: string; permitNumber: string },
  signature: { revision: number; signerName: string },
): Promise<void> {
  const [site] = await manager.query(`SELECT name FROM site WHERE id = $1`, [period.siteId]);
  await queueMail(
    manager,
    {
      eventKey: `signed:${period.id}:${signature.revision}`,
      kind: 'period-signed',
      content: {
        subject: `Signed: ${site.name}, permit ${period.permitNumber}, ${period.startsOn} – ${period.endsOn} (revision ${signature.revision})`,
        lines: [
          `${signature.signerName} signed the period ${period.startsOn} – ${period.endsOn} of permit ${period.permitNumber} at ${site.name} (revision ${signature.revision}).`,
          'Its period pack (PDF and spreadsheet) and evidence bundle are on the Reports page.',
        ],
        path: '/reports',
        linkText: 'Open Reports',
      },
    },
    await siteRecipients(manager, period.siteId, ['auditor', 'coordinator']),
  );
}
