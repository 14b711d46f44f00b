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
  'follow-ups.read',
  'follow-ups.close',
  'trail.read',
  'tools.use',
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
  'follow-ups.read': recordKeepers,
  'follow-ups.close': ['coordinator'],
  'trail.read': ['administrator', 'coordinator', 'auditor'],
  'tools.use': recordKeepers,
};

export function can(role: Role | null | undefined, action: Action): boolean {
  return role != null && permissionTable[action].includes(role);
}

export function permissionsOf(role: Role | null | undefined): Action[] {
  return actions.filter((action) => can(role, action));
}
