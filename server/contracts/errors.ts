import { z } from 'zod';

/** The one error shape every /api route answers with. `fields` maps an input path to its message. */
export const ErrorBody = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
  }),
});
export type ErrorBody = z.infer<typeof ErrorBody>;
