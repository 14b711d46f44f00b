import type { LimitRow, PeriodListItem, PeriodSummary, SubmissionRequest } from '@contracts/periods.js';
import { api, type RequestOf } from './client';

export type { LimitRow, PeriodListItem, PeriodSummary };

export const periodsApi = {
  list: (siteId: string) => api.get<{ items: PeriodListItem[] }>('/periods', { siteId }),
  summary: (id: string) => api.get<PeriodSummary>(`/periods/${id}/summary`),
  compile: (id: string) => api.post<PeriodSummary>(`/periods/${id}/compile`),
  recordSubmission: (id: string, body: RequestOf<typeof SubmissionRequest>) => api.put<PeriodSummary>(`/periods/${id}/submission`, body),
};
