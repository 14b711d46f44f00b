import { z } from 'zod';

/**
 * A finding of a check, shown on a result, a sample or a certificate. `source` names the
 * regulation, method section or rule of thumb the check comes from.
 */
export const FlagSeverity = z.enum(['error', 'warning', 'info']);
export const Flag = z.object({
  code: z.string(),
  severity: FlagSeverity,
  message: z.string(),
  source: z.string(),
});
export type Flag = z.infer<typeof Flag>;
export type FlagSeverity = z.infer<typeof FlagSeverity>;
