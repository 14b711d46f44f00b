import type { DataSource } from 'typeorm';
import { recordTrail } from '../kernel/trail/trail.js';
import { User } from '../kernel/people/user.entity.js';

export interface IdentityClaims {
  issuer: string;
  sub: string;
  email?: string;
  /** The provider's `email_verified` claim: only a verified address may claim a registered person. */
  emailVerified: boolean;
  name?: string;
}

/** Why a sign-in is refused after the provider said yes; `reason` is what the sign-in page explains. */
export class SignInRefused extends Error {
  constructor(readonly reason: 'account-inactive' | 'email-unverified' | 'email-taken') {
    super(reason);
  }
}

/**
 * Finds the Decant user behind a sign-in: by the provider's subject, else by e-mail (an
 * administrator may have registered the person before their first sign-in), else creates one
 * without a role. The e-mail claims a registered person only when the provider verified it and
 * the person is not bound to another subject yet. Roles and sites always come from Decant's
 * database, never from the token.
 */
export async function provisionUser(dataSource: DataSource, claims: IdentityClaims): Promise<User> {
  const subject = `${claims.issuer}|${claims.sub}`;
  const email = (claims.email ?? `${claims.sub}@unknown.invalid`).toLowerCase();
  return dataSource.transaction(async (manager) => {
    let user = await manager.findOneBy(User, { subject });
    if (!user) {
      const registered = await manager.findOneBy(User, { email });
      if (registered?.subject) throw new SignInRefused('email-taken');
      if (registered && !claims.emailVerified) throw new SignInRefused('email-unverified');
      user = registered;
    }
    const isNew = !user;
    user ??= manager.create(User, { email, name: claims.name ?? email, role: null, active: true });
    if (!user.active) throw new SignInRefused('account-inactive');
    user.subject = subject;
    user.lastSignInAt = new Date();
    user = await manager.save(User, user);
    await recordTrail(
      manager,
      { id: user.id, email: user.email },
      {
        action: isNew ? 'first-sign-in' : 'sign-in',
        entity: 'user',
        entityId: user.id,
        after: isNew ? { email: user.email, name: user.name, role: user.role } : null,
      },
    );
    return user;
  });
}
