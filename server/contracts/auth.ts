import { z } from 'zod';

/** Where to come back to after signing in, and whom the provider should expect. */
export const SignInQuery = z.object({
  returnTo: z.string().max(500).optional(),
  loginHint: z.email().max(254).optional(),
  /** '1': ask the provider to authenticate the person again (before a signature), whatever its session. */
  reauthenticate: z.literal('1').optional(),
});
export type SignInQuery = z.output<typeof SignInQuery>;

/** What the sign-in page may show: the demo accounts, in demo mode only. */
export interface SignInOptions {
  demo: { password: string; accounts: Array<{ email: string; name: string; role: string; duty: string }> } | null;
}
