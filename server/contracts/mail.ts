import { z } from 'zod';
import { can, type Role } from './permissions.js';

/** What Decant mails about; each person chooses per kind how it reaches them. */
export const mailKinds = ['violation', 'deadline', 'report-due', 'shipment-copy', 'upkeep', 'period-signed', 'digest'] as const;
export const MailKind = z.enum(mailKinds);
export type MailKind = z.infer<typeof MailKind>;

export const deliveries = ['now', 'digest', 'off'] as const;
export const Delivery = z.enum(deliveries);
export type Delivery = z.infer<typeof Delivery>;

export const mailKindWords: Record<MailKind, { title: string; detail: string }> = {
  violation: { title: 'A violation found', detail: 'The 24-hour notice and what follows from a result over a limit' },
  deadline: { title: 'Follow-up reminders', detail: 'Before a follow-up is due, when it is due, and when it becomes overdue' },
  'report-due': { title: 'Periodic report due', detail: '14 and 3 days before the report is due' },
  'shipment-copy': { title: 'Signed copy not back', detail: 'A shipment document whose signed copy has not come back in time' },
  upkeep: { title: 'Upkeep overdue', detail: 'An upkeep check past its interval' },
  'period-signed': { title: 'A period signed', detail: 'When a period at your sites is signed or its amendment signed' },
  digest: { title: 'Daily digest', detail: 'Once a day: what is due and overdue at your sites' },
};

/** What each role gets when it has chosen nothing. */
export function defaultDelivery(role: Role | null, kind: MailKind): Delivery {
  switch (role) {
    case 'coordinator':
      return 'now';
    case 'operator':
      return kind === 'upkeep' || kind === 'digest' ? 'now' : 'off';
    case 'auditor':
      return kind === 'period-signed' ? 'now' : 'off';
    default:
      return 'off';
  }
}

/** Kinds a role may not turn off: a coordinator is the one who must notify within 24 hours. */
export function mandatoryKinds(role: Role | null): MailKind[] {
  return can(role, 'mail.violations-always') ? ['violation'] : [];
}

export const MailPreference = z.object({
  kind: MailKind,
  delivery: Delivery,
  mandatory: z.boolean(),
});
export type MailPreference = z.infer<typeof MailPreference>;

export const MailPreferences = z.object({ items: z.array(MailPreference) });
export type MailPreferences = z.infer<typeof MailPreferences>;

export const MailPreferenceUpdate = z.object({
  items: z.array(z.object({ kind: MailKind, delivery: Delivery })).min(1),
});
export type MailPreferenceUpdate = z.infer<typeof MailPreferenceUpdate>;

/** A mail of a follow-up as the follow-up shows it. */
export const MailDeliveryView = z.object({
  recipient: z.string(),
  status: z.enum(['pending', 'sent', 'failed']),
  attempts: z.number(),
  sentAt: z.string().nullable(),
  lastError: z.string().nullable(),
});
export type MailDeliveryView = z.infer<typeof MailDeliveryView>;
