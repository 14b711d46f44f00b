import type { CreateLimitRequest, CreatePermitRequest, Limit, Permit, UpdateLimitRequest, UpdatePermitRequest } from '@contracts/setup.js';
import { api, type RequestOf } from './client';

export const permitsApi = {
  list: (siteId: string) => api.get<{ items: Permit[] }>('/permits', { siteId }),
  create: (body: RequestOf<typeof CreatePermitRequest>) => api.post<Permit>('/permits', body),
  update: (id: string, body: RequestOf<typeof UpdatePermitRequest>) => api.patch<Permit>(`/permits/${id}`, body),
  limits: (permitId: string) => api.get<{ items: Limit[] }>(`/permits/${permitId}/limits`),
  createLimit: (permitId: string, body: RequestOf<typeof CreateLimitRequest>) => api.post<Limit>(`/permits/${permitId}/limits`, body),
  updateLimit: (permitId: string, id: string, body: RequestOf<typeof UpdateLimitRequest>) =>
    api.patch<Limit>(`/permits/${permitId}/limits/${id}`, body),
  deleteLimit: (permitId: string, id: string) => api.delete<void>(`/permits/${permitId}/limits/${id}`),
  /** The limit stops applying after `endsOn`; it stays in the record. */
  endLimit: (permitId: string, id: string, endsOn: string) => api.delete<void>(`/permits/${permitId}/limits/${id}?endsOn=${endsOn}`),
};
