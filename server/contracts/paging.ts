import { z } from 'zod';

/** Paging for a list that is not sorted on request (it has one fixed order). */
export const PageQuery = z.object({
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
  sortDesc: z
    .enum(['true', 'false'])
    .optional()
    .transform((value) => value === 'true'),
  search: z.string().trim().max(200).optional(),
});
export type PageQuery = z.infer<typeof PageQuery>;

/**
 * Paging for a list sorted by one of its own keys: any other key (say `constructor`) is a 400
 * naming `sortBy`, never a column looked up by whatever name was sent.
 */
export function sortedPageQuery<const K extends readonly [string, ...string[]]>(sortKeys: K) {
  return PageQuery.extend({ sortBy: z.enum(sortKeys).optional() });
}

export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}
