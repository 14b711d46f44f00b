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
