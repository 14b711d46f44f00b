import type { CreateEquipmentRequest, EquipmentView, UpdateEquipmentRequest } from '@contracts/oil.js';
import { api, type RequestOf } from './client';

export const equipmentApi = {
  list: (siteId: string) => api.get<{ items: EquipmentView[] }>('/equipment', { siteId }),
  get: (id: string) => api.get<EquipmentView>(`/equipment/${id}`),
  create: (body: RequestOf<typeof CreateEquipmentRequest>) => api.post<EquipmentView>('/equipment', body),
  update: (id: string, body: RequestOf<typeof UpdateEquipmentRequest>) => api.patch<EquipmentView>(`/equipment/${id}`, body),
};
