import type { SiteSummary } from '@contracts/sites.js';

export type SiteDraft = Pick<
  SiteSummary,
  'name' | 'address' | 'timeZone' | 'retentionYears' | 'generatorStatus' | 'manifestRule' | 'oilStorageCapacityGallons'
>;

export const generatorItems = [
  { title: 'Large quantity generator', value: 'large' },
  { title: 'Small quantity generator', value: 'small' },
  { title: 'Very small quantity generator', value: 'very-small' },
];
export const manifestItems = [
  { title: 'Current federal rule (2025)', value: 'current' },
  { title: 'Rule before 2025', value: 'before-2025' },
];
export const titleOf = (items: Array<{ title: string; value: string }>, value: string) =>
  items.find((item) => item.value === value)?.title ?? value;
