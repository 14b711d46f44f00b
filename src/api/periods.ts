import type { Page } from '@contracts/paging.js';
import type { LimitRow, PeriodSummary } from '@contracts/periods.js';
import { api, type Query } from './client';

export type { LimitRow, PeriodSummary };

export interface PeriodListItem {
  id: string;
  permitId: string;
  permitNumber: string;
  siteId: string;
  startsOn: string;
  endsOn: string;
  dueOn: string;
  status: 'open' | 'compiled' | 'signed' | 'amended';
  compiledAt: string | null;
}

export interface FollowUp {
  id: string;
  siteId: string;
  kind: string;
  title: string;
  dueAt: string;
  status: 'open' | 'done' | 'done-late';
  closedAt: string | null;
  closingNote: string | null;
  hasClosingFile: boolean;
}

export const periodsApi = {
  list: (siteId: string) => api.get<{ items: PeriodListItem[] }>('/periods', { siteId }),
  summary: (id: string) => api.get<PeriodSummary>(`/periods/${id}/summary`),
  compile: (id: string) => api.post<PeriodSummary>(`/periods/${id}/compile`),
  followUps: (query: Query) => api.get<Page<FollowUp>>('/follow-ups', query),
};
