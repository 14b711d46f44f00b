import { z } from 'zod';
import { sortedPageQuery } from './paging.js';
import { Role } from './permissions.js';
import type { Action } from './permissions.js';
import type { SiteSummary } from './sites.js';

export const UserView = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: Role.nullable(),
  active: z.boolean(),
  siteIds: z.array(z.uuid()),
  lastSignInAt: z.string().nullable(),
  createdAt: z.string(),
});
export type UserView = z.infer<typeof UserView>;

export const CreateUserRequest = z.object({
  email: z
    .email('Enter a valid e-mail address')
    .max(254)
    .transform((value) => value.toLowerCase()),
  name: z.string().trim().min(1, 'Enter a name').max(120),
  role: Role.nullable(),
  siteIds: z.array(z.uuid()).max(500).default([]),
  active: z.boolean().default(true),
});
export type CreateUserRequest = z.infer<typeof CreateUserRequest>;

export const UpdateUserRequest = z
  .object({
    name: z.string().trim().min(1, 'Enter a name').max(120),
    role: Role.nullable(),
    siteIds: z.array(z.uuid()).max(500),
    active: z.boolean(),
  })
  .partial()
  .refine((body) => Object.keys(body).length > 0, { message: 'Nothing to change' });
export type UpdateUserRequest = z.infer<typeof UpdateUserRequest>;

export const userSortKeys = ['email', 'name', 'role', 'lastSignInAt', 'createdAt'] as const;
export const UserListQuery = sortedPageQuery(userSortKeys);
export type UserListQuery = z.output<typeof UserListQuery>;

export const UnitSystem = z.enum(['us', 'metric']);
export type UnitSystem = z.infer<typeof UnitSystem>;
export const UpdatePreferencesRequest = z.object({ unitSystem: UnitSystem });

export interface Me {
  user: { id: string; email: string; name: string; role: Role | null; unitSystem: UnitSystem };
  sites: SiteSummary[];
  permissions: Action[];
}

export type UpdatePreferencesRequest = z.output<typeof UpdatePreferencesRequest>;
