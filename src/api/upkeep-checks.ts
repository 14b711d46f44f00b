import type { UpkeepCheckRequest, UpkeepCheckView, upkeepItems } from '@contracts/oil.js';
import { api, upload, type RequestOf } from './client';

export const upkeepChecksApi = {
  list: (equipmentId: string) => api.get<{ items: UpkeepCheckView[]; checklist: typeof upkeepItems }>('/upkeep-checks', { equipmentId }),
  create: (body: RequestOf<typeof UpkeepCheckRequest>) => api.post<UpkeepCheckView>('/upkeep-checks', body),
  uploadPhoto: (siteId: string, file: File) => upload<{ id: string }>('POST', '/upkeep-checks/photos', { siteId, file }),
  photoUrl: (fileId: string) => `/api/upkeep-checks/photos/${fileId}`,
};
