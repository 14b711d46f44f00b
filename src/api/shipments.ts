import type { Page } from '@contracts/paging.js';
import type { CreateShipmentRequest, ShipmentView, UpdateShipmentRequest } from '@contracts/shipments.js';
import { api, upload, type Query, type RequestOf } from './client';

export const shipmentsApi = {
  page: (query: Query) => api.get<Page<ShipmentView>>('/shipments', query),
  create: (body: RequestOf<typeof CreateShipmentRequest>) => api.post<ShipmentView>('/shipments', body),
  update: (id: string, body: RequestOf<typeof UpdateShipmentRequest>) => api.patch<ShipmentView>(`/shipments/${id}`, body),
  attachScan: (id: string, file: File) => upload<ShipmentView>('POST', `/shipments/${id}/files`, { file }),
  scanUrl: (id: string, fileId: string) => `/api/shipments/${id}/files/${fileId}`,
};
