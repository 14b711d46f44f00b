import type { ValueTransformer } from 'typeorm';

/**
 * PostgreSQL answers numeric columns as text (to keep their precision); Decant's numerics
 * (limits, results, volumes) fit a double, so entities read and write them as numbers.
 */
export const numeric: ValueTransformer = {
  to: (value: number | null | undefined) => value,
  from: (value: string | null) => (value === null ? null : Number(value)),
};
