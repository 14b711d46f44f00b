import { z } from 'zod';
import { uuid } from './fields.js';

/** Path parameters shared by many routes. */
export const IdParams = z.object({ id: uuid });
export type IdParams = z.infer<typeof IdParams>;

export const SiteParams = z.object({ siteId: uuid });
export type SiteParams = z.infer<typeof SiteParams>;

/** A list narrowed to one of the caller's sites, or all of them. */
export const OptionalSiteQuery = z.object({ siteId: uuid.optional() });
export type OptionalSiteQuery = z.infer<typeof OptionalSiteQuery>;

/** A list of one site's records. */
export const SiteQuery = z.object({ siteId: uuid });
export type SiteQuery = z.infer<typeof SiteQuery>;

export const SiteRecordParams = SiteParams.extend({ id: uuid });
export type SiteRecordParams = z.infer<typeof SiteRecordParams>;

export const LimitParams = IdParams.extend({ limitId: uuid });
export type LimitParams = z.infer<typeof LimitParams>;

export const FileParams = z.object({ fileId: uuid });
export type FileParams = z.infer<typeof FileParams>;

export const RecordFileParams = IdParams.extend({ fileId: uuid });
export type RecordFileParams = z.infer<typeof RecordFileParams>;
