import type { EntityManager } from 'typeorm';
import type { DataSource } from 'typeorm';
import { defaultDelivery, mailKinds, mandatoryKinds, type Delivery, type MailKind, type MailPreference } from '../../contracts/mail.js';
import type { Role } from '../../contracts/permissions.js';

type Db = DataSource | EntityManager;

/** How a kind of mail reaches each of these people: their choice, else their role's default. */
export async function deliveriesFor(
  db: Db,
  people: Array<{ id: string; role: Role | null }>,
  kind: MailKind,
): Promise<Map<string, Delivery>> {
  const chosen: Array<{ user_id: string; delivery: Delivery }> = people.length
    ? await db.query(`SELECT user_id, delivery FROM mail_preference WHERE kind = $1 AND user_id = ANY($2::uuid[])`, [
        kind,
        people.map((p) => p.id),
      ])
    : [];
  const choice = new Map(chosen.map((row) => [row.user_id, row.delivery]));
  return new Map(
    people.map((person) => {
      const delivery = choice.get(person.id) ?? defaultDelivery(person.role, kind);
      // A mandatory kind reaches its people at once whatever is stored.
      return [person.id, mandatoryKinds(person.role).includes(kind) ? 'now' : delivery];
    }),
  );
}

export async function preferencesOf(db: Db, userId: string, role: Role | null): Promise<MailPreference[]> {
  const chosen: Array<{ kind: MailKind; delivery: Delivery }> = await db.query(
    `SELECT kind, delivery FROM mail_preference WHERE user_id = $1`,
    [userId],
  );
  const choice = new Map(chosen.map((row) => [row.kind, row.delivery]));
  const mandatory = mandatoryKinds(role);
  return mailKinds.map((kind) => ({
    kind,
    delivery: mandatory.includes(kind) ? 'now' : (choice.get(kind) ?? defaultDelivery(role, kind)),
    mandatory: mandatory.includes(kind),
  }));
}

export async function savePreference(db: Db, userId: string, kind: MailKind, delivery: Delivery): Promise<void> {
  await db.query(
    `INSERT INTO mail_preference (user_id, kind, delivery) VALUES ($1, $2, $3)
     ON CONFLICT (user_id, kind) DO UPDATE SET delivery = EXCLUDED.delivery, updated_at = now()`,
    [userId, kind, delivery],
  );
}
