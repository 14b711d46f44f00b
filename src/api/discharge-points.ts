import type { CreateDischargePointRequest, DischargePoint, UpdateDischargePointRequest } from '@contracts/setup.js';
import { api, type RequestOf } from './client';

export const dischargePointsApi = {
  list: (siteId: string) => api.get<{ items: DischargePoint[] }>(`/sites/${siteId}/discharge-points`),
  create: (siteId: string, body: RequestOf<typeof CreateDischargePointRequest>) =>
    api.post<DischargePoint>(`/sites/${siteId}/discharge-points`, body),
  update: (siteId: string, id: string, body: RequestOf<typeof UpdateDischargePointRequest>) =>
    api.patch<DischargePoint>(`/sites/${siteId}/discharge-points/${id}`, body),
};
