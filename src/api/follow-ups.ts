import type { CorrectAwarenessRequest, FollowUpView } from '@contracts/follow-ups.js';
import type { NoticeDraftRequest, NoticeView } from '@contracts/notices.js';
import type { Page } from '@contracts/paging.js';
import { api, upload, type Query } from './client';

export const followUpsApi = {
  page: (query: Query) => api.get<Page<FollowUpView>>('/follow-ups', query),
  close: (id: string, note: string, evidence: File | null) =>
    upload<FollowUpView>('POST', `/follow-ups/${id}/close`, { note, file: evidence }),
  fileUrl: (id: string) => `/api/follow-ups/${id}/file`,
  notice: (id: string) => api.get<NoticeView>(`/follow-ups/${id}/notice`),
  saveNotice: (id: string, body: NoticeDraftRequest) => api.put<NoticeView>(`/follow-ups/${id}/notice`, body),
  sendNotice: (id: string, body: NoticeDraftRequest) => api.post<NoticeView>(`/follow-ups/${id}/notice/send`, body),
  correctAwareness: (id: string, body: CorrectAwarenessRequest) => api.post<FollowUpView>(`/follow-ups/${id}/aware-since`, body),
};
