import { z } from 'zod';

/** Field schemas shared by several contracts. */
export const isoDate = z.iso.date('Use the form YYYY-MM-DD');
/** A local date-time of a site, without offset: the site's time zone gives its meaning. */
export const localDateTime = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2})?$/, 'Use the form YYYY-MM-DDTHH:mm (site local time)');

export const timeZone = z.string().refine((zone) => {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: zone });
    return zone.includes('/') || zone === 'UTC';
  } catch {
    return false;
  }
}, 'Not an IANA time zone name (for example America/Chicago)');

/** A decimal as text, so the significant figures the lab reported survive. */
export const decimalText = z
  .union([z.number().finite(), z.string().trim()])
  .transform((value) => String(value))
  .refine((text) => /^-?(\d+\.?\d*|\.\d+)$/.test(text), 'Not a number');

export const uuid = z.uuid('Not a valid id');

/**
 * The schema of a partial update: every field optional and no defaults. Zod applies a field's
 * default even inside `.partial()`, which would silently reset fields a PATCH did not name.
 */
export function updateOf<T extends z.ZodRawShape>(schema: z.ZodObject<T>): ReturnType<z.ZodObject<T>['partial']> {
  const shape = Object.fromEntries(
    Object.entries(schema.shape).map(([key, field]) => [key, field instanceof z.ZodDefault ? field.unwrap() : field]),
  );
  return z.object(shape).partial() as unknown as ReturnType<z.ZodObject<T>['partial']>;
}
