import { z } from 'zod';
import { isoDate, timeZone, updateOf, uuid } from './fields.js';
import { GeneratorStatus, ManifestRule } from './sites.js';
import { limitUnitNames, unitNames } from './unit-names.js';

export { limitUnitNames, unitNames };

const unit = z.enum(unitNames as [string, ...string[]], 'Not a unit Decant knows');
const limitUnit = z.enum(limitUnitNames as [string, ...string[]], 'Not a unit Decant knows');

export const SiteFields = z.object({
  name: z.string().trim().min(1, 'Enter a name').max(200),
  address: z.string().trim().max(500).default(''),
  timeZone,
  retentionYears: z.number().int().min(3, 'Records must be kept at least 3 years (40 CFR 403.12(o), 122.41(j)(2))').max(100),
  generatorStatus: GeneratorStatus,
  manifestRule: ManifestRule.default('current'),
  oilStorageCapacityGallons: z.number().min(0).max(10_000_000).nullable().default(null),
});
export const CreateSiteRequest = SiteFields;
export const UpdateSiteRequest = updateOf(SiteFields);

export const DischargePointFields = z.object({
  code: z
    .string()
    .trim()
    .min(1, 'Enter a code')
    .max(40)
    .regex(/^[A-Za-z0-9._-]+$/, 'Letters, digits, dot, dash and underscore only'),
  name: z.string().trim().min(1, 'Enter a name').max(200),
  receiving: z.enum(['sewer', 'surface-water']),
  active: z.boolean().default(true),
});
export const CreateDischargePointRequest = DischargePointFields;
export const UpdateDischargePointRequest = updateOf(DischargePointFields);
export type DischargePoint = z.infer<typeof DischargePointFields> & { id: string; siteId: string };

export const ParameterFields = z.object({
  siteId: uuid.nullable().default(null),
  code: z
    .string()
    .trim()
    .min(1)
    .max(60)
    .regex(/^[a-z0-9-]+$/, 'Lower-case letters, digits and dashes'),
  name: z.string().trim().min(1, 'Enter a name').max(200),
  fraction: z.enum(['HEM', 'SGT-HEM']).nullable().default(null),
  defaultUnit: unit,
  /** 40 CFR 403.8(f)(2)(viii)(B): 1.4 for BOD, TSS, fats, oil and grease; 1.2 for others; none for pH. */
  sncReviewFactor: z.number().min(1).max(10).nullable().default(1.2),
});
export const CreateParameterRequest = ParameterFields;
export const UpdateParameterRequest = updateOf(ParameterFields.omit({ siteId: true }));
export type Parameter = z.infer<typeof ParameterFields> & { id: string };

/** The permit settings that change results: versioned, each version applying from a day. */
export const PermitSettingsFields = z.object({
  nonDetectPolicy: z.enum(['zero', 'mdl', 'ml', 'half-mdl']),
  dailyMaxAppliesToEachGrab: z.boolean().default(false),
  massLoadingFactor: z.union([z.literal(8.34), z.literal(8.3454)], 'Either 8.34 or 8.3454').default(8.34),
  sncWindow: z.enum(['calendar-halves', 'rolling']).default('calendar-halves'),
  lateReportDays: z.number().int().min(1).max(365).default(45),
  /** Sampling days (two grabs on one day are one sampling event; common practice) or every sample. */
  monitoringCounts: z.enum(['sampling-days', 'samples']).default('sampling-days'),
});
export const permitSettingNames = Object.keys(PermitSettingsFields.shape) as Array<keyof z.infer<typeof PermitSettingsFields>>;

export const PermitFields = z
  .object({
    siteId: uuid,
    kind: z.enum(['pretreatment', 'npdes']),
    number: z.string().trim().min(1, 'Enter the permit number').max(60),
    issuingAuthority: z.string().trim().min(1, 'Enter the issuing authority').max(200),
    authorityEmail: z.email('Enter a valid e-mail address').nullable().default(null),
    effectiveFrom: isoDate,
    effectiveTo: isoDate.nullable().default(null),
    reportingFrequency: z.enum(['monthly', 'quarterly', 'semiannual']),
    reportDueDays: z.number().int().min(0).max(365),
  })
  .extend(PermitSettingsFields.shape);
const effectiveOrder = (permit: { effectiveFrom?: string; effectiveTo?: string | null }) =>
  !permit.effectiveFrom || !permit.effectiveTo || permit.effectiveTo >= permit.effectiveFrom;
export const CreatePermitRequest = PermitFields.refine(effectiveOrder, { path: ['effectiveTo'], message: 'Ends before it starts' });
/** `settingsFrom`: the first day changed settings apply (by default the start of the running period); earlier periods keep theirs. */
export const UpdatePermitRequest = updateOf(PermitFields.omit({ siteId: true }))
  .extend({ settingsFrom: isoDate.optional() })
  .refine(effectiveOrder, {
    path: ['effectiveTo'],
    message: 'Ends before it starts',
  });
export type Permit = z.infer<typeof PermitFields> & {
  id: string;
  /** The first day the settings shown (those in force today) apply. */
  settingsFrom: string;
};
export type PermitSettingsValues = z.infer<typeof PermitSettingsFields>;

export const limitStatistics = ['daily-maximum', 'monthly-average', 'instantaneous-minimum', 'instantaneous-maximum'] as const;
export const LimitFields = z.object({
  dischargePointId: uuid,
  parameterId: uuid,
  statistic: z.enum(limitStatistics),
  /** Column numeric(14,4): at most 10 digits before the point. */
  value: z.number().finite().min(0).max(9_999_999_999, 'Too large'),
  unit: limitUnit,
  frequencyCount: z.number().int().min(1).max(1000),
  frequencyPer: z.enum(['day', 'week', 'month', 'quarter']),
  sampleType: z.enum(['grab', 'composite']),
  /** Decimal places the permit asks figures to be reported to; null: the method's or the usual precision. */
  reportedDecimals: z.number().int().min(0, 'From 0 to 6 decimal places').max(6, 'From 0 to 6 decimal places').nullable().default(null),
});
/** `appliesFrom`: the first day the limit (or its new version) applies; by default the permit's start for a new limit, the running period's start for a change. */
export const CreateLimitRequest = LimitFields.extend({ appliesFrom: isoDate.optional() });
export const UpdateLimitRequest = updateOf(LimitFields).extend({ appliesFrom: isoDate.optional() });
/** Ending a limit: the last day it applies. Without it, only a limit of a permit that judged nothing yet is deleted. */
export const EndLimitQuery = z.object({ endsOn: isoDate.optional() });
export type EndLimitQuery = z.output<typeof EndLimitQuery>;
export type Limit = z.infer<typeof LimitFields> & {
  id: string;
  permitId: string;
  /** The first day this version applies. */
  appliesFrom: string;
  /** The last day it applies; null while in force. */
  appliesTo: string | null;
  /** Shared by every version of one limit. */
  seriesId: string;
};

export type CreateSiteRequest = z.output<typeof CreateSiteRequest>;
export type UpdateSiteRequest = z.output<typeof UpdateSiteRequest>;
export type CreateDischargePointRequest = z.output<typeof CreateDischargePointRequest>;
export type UpdateDischargePointRequest = z.output<typeof UpdateDischargePointRequest>;
export type CreateParameterRequest = z.output<typeof CreateParameterRequest>;
export type UpdateParameterRequest = z.output<typeof UpdateParameterRequest>;
export type CreatePermitRequest = z.output<typeof CreatePermitRequest>;
export type UpdatePermitRequest = z.output<typeof UpdatePermitRequest>;
export type CreateLimitRequest = z.output<typeof CreateLimitRequest>;
export type UpdateLimitRequest = z.output<typeof UpdateLimitRequest>;
