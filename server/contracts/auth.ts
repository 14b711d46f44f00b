import { z } from 'zod';

/** Where to come back to after signing in, and whom the provider should expect. */
export const SignInQuery = z.object({
  returnTo: z.string().max(500).optional(),
  loginHint: z.email().max(254).optional(),
});
export type SignInQuery = z.output<typeof SignInQuery>;
