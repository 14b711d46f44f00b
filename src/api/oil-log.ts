import type { CreateOilLogRequest, OilLogEntryView, UpdateOilLogRequest } from '@contracts/oil.js';
import type { Page } from '@contracts/paging.js';
import { api, type Query, type RequestOf } from './client';

export const oilLogApi = {
  page: (query: Query) => api.get<Page<OilLogEntryView>>('/oil-log', query),
  totals: (query: Query) =>
    api.get<{ by: string; items: Array<{ period: string; litres: number; entries: number }> }>('/oil-log/totals', query),
  create: (body: RequestOf<typeof CreateOilLogRequest>) => api.post<OilLogEntryView>('/oil-log', body),
  update: (id: string, body: RequestOf<typeof UpdateOilLogRequest>) => api.patch<OilLogEntryView>(`/oil-log/${id}`, body),
};
