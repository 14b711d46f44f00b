import type {
  AmendRequest,
  LimitRow,
  PeriodListItem,
  PeriodSummary,
  Revision,
  SignOffChecklist,
  SignRequest,
  SubmissionRequest,
} from '@contracts/periods.js';
import { api, type RequestOf } from './client';

export type { LimitRow, PeriodListItem, PeriodSummary, Revision, SignOffChecklist };

export const periodsApi = {
  list: (siteId: string) => api.get<{ items: PeriodListItem[] }>('/periods', { siteId }),
  summary: (id: string) => api.get<PeriodSummary>(`/periods/${id}/summary`),
  compile: (id: string) => api.post<PeriodSummary>(`/periods/${id}/compile`),
  signOffChecklist: (id: string) => api.get<SignOffChecklist>(`/periods/${id}/sign-off`),
  sign: (id: string, body: RequestOf<typeof SignRequest>) => api.post<PeriodSummary>(`/periods/${id}/sign`, body),
  amend: (id: string, body: RequestOf<typeof AmendRequest>) => api.post<PeriodSummary>(`/periods/${id}/amendments`, body),
  revisions: (id: string) => api.get<{ items: Revision[] }>(`/periods/${id}/revisions`),
  revision: (id: string, revision: number) => api.get<PeriodSummary>(`/periods/${id}/revisions/${revision}`),
  recordSubmission: (id: string, body: RequestOf<typeof SubmissionRequest>) => api.put<PeriodSummary>(`/periods/${id}/submission`, body),
};
