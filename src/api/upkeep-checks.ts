import type { UpkeepCheckRequest, UpkeepCheckView } from '@contracts/oil.js';
import type { UpkeepItem } from '@contracts/upkeep-checklists.js';
import { api, upload, type RequestOf } from './client';

export const upkeepChecksApi = {
  list: (equipmentId: string) => api.get<{ items: UpkeepCheckView[]; checklist: UpkeepItem[] }>('/upkeep-checks', { equipmentId }),
  create: (body: RequestOf<typeof UpkeepCheckRequest>) => api.post<UpkeepCheckView>('/upkeep-checks', body),
  uploadPhoto: (siteId: string, file: File) => upload<{ id: string }>('POST', '/upkeep-checks/photos', { siteId, file }),
  photoUrl: (fileId: string) => `/api/upkeep-checks/photos/${fileId}`,
};
