import { z } from 'zod';

// Field schemas shared by several contracts.

/** A calendar date of this trade's records: year 1900 to 2199 (year 0 does not exist in PostgreSQL). */
export const isoDate = z.iso
  .date('Use the form YYYY-MM-DD')
  .refine((day) => day >= '1900-01-01' && day <= '2199-12-31', 'Use a date between 1900 and 2199');
/** A local date-time of a site, without offset: the site's time zone gives its meaning. */
export const localDateTime = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2})?$/, 'Use the form YYYY-MM-DDTHH:mm (site local time)')
  .refine((text) => text >= '1900' && text < '2200', 'Use a date between 1900 and 2199');

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
  .refine((text) => /^-?(\d+\.?\d*|\.\d+)$/.test(text), { message: 'Not a number', abort: true })
  // Stored as numeric(18,6): 12 digits before the point at most.
  .refine((text) => /^-?0*\d{0,12}(\.\d*)?$/.test(text), 'Too large to be a measurement');

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
