import type { DataSource } from 'typeorm';
import { recordTrail } from '../kernel/trail/trail.js';
import { User } from '../kernel/people/user.entity.js';

export interface IdentityClaims {
  issuer: string;
  sub: string;
  email?: string;
  name?: string;
}

export class InactiveUserError extends Error {}

/**
 * Finds the Decant user behind a sign-in: by the provider's subject, else by e-mail (an
 * administrator may have registered the person before their first sign-in), else creates one
 * without a role. Roles and sites always come from Decant's database, never from the token.
 */
export async function provisionUser(dataSource: DataSource, claims: IdentityClaims): Promise<User> {
  const subject = `${claims.issuer}|${claims.sub}`;
  const email = (claims.email ?? `${claims.sub}@unknown.invalid`).toLowerCase();
  return dataSource.transaction(async (manager) => {
    let user = await manager.findOneBy(User, { subject });
    user ??= await manager.findOneBy(User, { email });
    const isNew = !user;
    user ??= manager.create(User, { email, name: claims.name ?? email, role: null, active: true });
    if (!user.active) throw new InactiveUserError(email);
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
