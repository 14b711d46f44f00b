import type { DischargePoint, Limit, Parameter, Permit } from '@contracts/setup.js';
import { api } from './client';

type WithId<T> = T & { id: string };
export const setupApi = {
  points: (siteId: string) => api.get<{ items: DischargePoint[] }>(`/sites/${siteId}/discharge-points`),
  createPoint: (siteId: string, body: unknown) => api.post<DischargePoint>(`/sites/${siteId}/discharge-points`, body),
  updatePoint: (siteId: string, id: string, body: unknown) => api.patch<DischargePoint>(`/sites/${siteId}/discharge-points/${id}`, body),
  parameters: (siteId?: string) => api.get<{ items: Parameter[] }>('/parameters', { siteId }),
  permits: (siteId: string) => api.get<{ items: WithId<Permit>[] }>('/permits', { siteId }),
  createPermit: (body: unknown) => api.post<Permit>('/permits', body),
  updatePermit: (id: string, body: unknown) => api.patch<Permit>(`/permits/${id}`, body),
  limits: (permitId: string) => api.get<{ items: Limit[] }>(`/permits/${permitId}/limits`),
  createLimit: (permitId: string, body: unknown) => api.post<Limit>(`/permits/${permitId}/limits`, body),
  updateLimit: (permitId: string, id: string, body: unknown) => api.patch<Limit>(`/permits/${permitId}/limits/${id}`, body),
  deleteLimit: (permitId: string, id: string) => api.delete<void>(`/permits/${permitId}/limits/${id}`),
  updateSite: (id: string, body: unknown) => api.patch<unknown>(`/sites/${id}`, body),
};
