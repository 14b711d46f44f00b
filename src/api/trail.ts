import type { Page } from '@contracts/paging.js';
import type { TrailEntryView, TrailVerification } from '@contracts/trail.js';
import { api, type Query } from './client';

export const trailApi = {
  page: (query: Query) => api.get<Page<TrailEntryView>>('/trail', query),
  verify: () => api.get<TrailVerification>('/trail/verification'),
};
