import { z } from 'zod';

export const generatorStatuses = ['large', 'small', 'very-small'] as const;
export const GeneratorStatus = z.enum(generatorStatuses);

/** Which version of 40 CFR 262.42 the site's state applies: the 2025 e-Manifest rule or the one before. */
export const ManifestRule = z.enum(['current', 'before-2025']);

export const SiteSummary = z.object({
  id: z.uuid(),
  companyName: z.string(),
  name: z.string(),
  address: z.string(),
  timeZone: z.string(),
  retentionYears: z.number().int(),
  generatorStatus: GeneratorStatus,
  manifestRule: ManifestRule,
  oilStorageCapacityGallons: z.number().nullable(),
});
export type SiteSummary = z.infer<typeof SiteSummary>;
