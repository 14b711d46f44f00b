import { z } from 'zod';
import { isoDate, uuid } from './fields.js';
import { PageQuery } from './paging.js';

export const flowUnits = ['gal/day', 'MGD', 'm³/day'] as const;

/** One day's flow at a discharge point: a second reading for the same day replaces the first. */
export const FlowReadingRequest = z.object({
  dischargePointId: uuid,
  day: isoDate,
  value: z.number().finite().min(0, 'Cannot be negative').max(1e9),
  unit: z.enum(flowUnits),
});
export type FlowReadingRequest = z.output<typeof FlowReadingRequest>;

export const FlowReadingQuery = PageQuery.extend({ siteId: uuid, from: isoDate.optional(), to: isoDate.optional() });
export type FlowReadingQuery = z.output<typeof FlowReadingQuery>;

export interface FlowReadingView {
  id: string;
  dischargePointId: string;
  pointCode: string;
  day: string;
  value: number;
  unit: (typeof flowUnits)[number];
}

export interface FlowImportReport {
  committed: boolean;
  rows: number;
  readings: number;
  errors: Array<{ row: number; column: string | null; message: string }>;
}
