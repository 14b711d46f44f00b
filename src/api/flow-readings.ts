import type { FlowImportReport, FlowReadingRequest, FlowReadingView } from '@contracts/flow-readings.js';
import type { Page } from '@contracts/paging.js';
import { api, upload, type Query, type RequestOf } from './client';

export const flowReadingsApi = {
  page: (query: Query) => api.get<Page<FlowReadingView>>('/flow-readings', query),
  record: (body: RequestOf<typeof FlowReadingRequest>) => api.post<FlowReadingRequest>('/flow-readings', body),
  importFile: (siteId: string, file: File, commit: boolean) =>
    upload<FlowImportReport>('POST', '/flow-readings/import', { siteId, commit: String(commit), file }),
};
