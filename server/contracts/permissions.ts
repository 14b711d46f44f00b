import { z } from 'zod';

/**
 * Who may do what. One table, read by every API route (server/middleware/require-permission.ts)
 * and by the client to decide what to show. Site access is checked separately: a permission
 * says what a role may do, the user's sites say where.
 */
export const roles = ['administrator', 'coordinator', 'operator', 'auditor'] as const;
export const Role = z.enum(roles);
export type Role = z.infer<typeof Role>;

export const roleLabels: Record<Role, string> = {
  administrator: 'Administrator',
  coordinator: 'EHS coordinator',
  operator: 'Operator',
  auditor: 'Auditor',
};

export const actions = [
  'users.read',
  'users.manage',
  'sites.read',
  'setup.manage',
  'lab.read',
  'lab.write',
  'oil-log.read',
  'oil-log.write',
  'shipments.read',
  'shipments.write',
  'periods.read',
  'periods.compile',
  'periods.sign',
  'periods.amend',
  'follow-ups.read',
  'follow-ups.close',
  'trail.read',
  'tools.use',
  'oil-log.correct-any',
  'shipments.change-after-signed-copy',
  'trail.read-siteless',
  'mail.violations-always',
] as const;
export type Action = (typeof actions)[number];

const everyone: readonly Role[] = roles;
const recordKeepers: readonly Role[] = ['coordinator', 'operator', 'auditor'];

export const permissionTable: Record<Action, readonly Role[]> = {
  'users.read': ['administrator'],
  'users.manage': ['administrator'],
  'sites.read': everyone,
  'setup.manage': ['coordinator'],
  'lab.read': recordKeepers,
  'lab.write': ['coordinator'],
  'oil-log.read': recordKeepers,
  'oil-log.write': ['coordinator', 'operator'],
  'shipments.read': recordKeepers,
  'shipments.write': ['coordinator', 'operator'],
  'periods.read': ['coordinator', 'auditor'],
  'periods.compile': ['coordinator'],
  // Signing vouches for the figures under penalty of law: a permission of its own, so it can be given to a named signatory.
  'periods.sign': ['coordinator'],
  'periods.amend': ['coordinator'],
  'follow-ups.read': recordKeepers,
  'follow-ups.close': ['coordinator'],
  'trail.read': ['administrator', 'coordinator', 'auditor'],
  // Calculators for the equipment: for those who run it and answer for it, not for the auditor.
  'tools.use': ['coordinator', 'operator'],
  // Operators correct only their own entries, within their first 24 hours (oil-log.service).
  'oil-log.correct-any': ['coordinator'],
  // Once the hauler's signed copy is back, the papers are the coordinator's to change.
  'shipments.change-after-signed-copy': ['coordinator'],
  // Trail entries of no site (people, sign-ins).
  'trail.read-siteless': ['administrator', 'auditor'],
  // The one who must notify the authority within 24 hours hears of a violation at once, whatever they chose.
  'mail.violations-always': ['coordinator'],
};

export function can(role: Role | null | undefined, action: Action): boolean {
  return role != null && permissionTable[action].includes(role);
}

export function permissionsOf(role: Role | null | undefined): Action[] {
  return actions.filter((action) => can(role, action));
}

/** The first 24 hours after a record is entered: corrections after them say why (oil log, certificates, shipments). */
export const CORRECTION_WINDOW_MS = 24 * 3600 * 1000;
/** An author's own correction window for an oil-log entry; after it a reason is required. */
export const OIL_LOG_AUTHOR_WINDOW_MS = CORRECTION_WINDOW_MS;

/** Where a role lands after sign-in: the operator's work is the oil log, the auditor's the reports, everyone else's the overview. */
export type LandingPage = 'oil-log' | 'overview' | 'reports';
const landingPages: Record<Role, LandingPage> = {
  administrator: 'overview',
  coordinator: 'overview',
  operator: 'oil-log',
  auditor: 'reports',
};
export function landingPageOf(role: Role | null | undefined): LandingPage {
  return role ? landingPages[role] : 'overview';
}

/** Whether a user may correct an oil-log entry: their own within its first day, any entry with `oil-log.correct-any`. */
export function mayCorrectOilLogEntry(
  user: { id: string; role: Role | null | undefined },
  entry: { enteredBy: string | null; createdAt: string },
  now: Date = new Date(),
): { allowed: boolean; reasonRequired: boolean; refusal?: string } {
  const fresh = now.getTime() - new Date(entry.createdAt).getTime() < OIL_LOG_AUTHOR_WINDOW_MS;
  if (can(user.role, 'oil-log.correct-any')) return { allowed: true, reasonRequired: !fresh };
  if (!can(user.role, 'oil-log.write')) return { allowed: false, reasonRequired: false, refusal: 'You cannot change the oil log' };
  if (entry.enteredBy !== user.id) return { allowed: false, reasonRequired: false, refusal: 'Operators correct only their own entries' };
  if (!fresh) return { allowed: false, reasonRequired: false, refusal: 'Entries older than 24 hours are corrected by a coordinator' };
  return { allowed: true, reasonRequired: false };
}
