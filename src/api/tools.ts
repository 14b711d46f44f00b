import type { ApplicationSheetHistory, SaveApplicationSheetRequest } from '@contracts/application-sheet.js';
import type {
  SaveTankCheckRequest,
  SavedTankCheck,
  SkimmerFitView,
  TankCheckRequest,
  TankCheckStart,
  TankCheckView,
} from '@contracts/tools.js';
import { api, type RequestOf } from './client';

export const toolsApi = {
  skimmerFit: (siteId: string) => api.get<SkimmerFitView>('/tools/skimmer-fit', { siteId }),
  tankCheck: (body: RequestOf<typeof TankCheckRequest>) => api.post<TankCheckView>('/tools/tank-check', body),
  tankCheckStart: (from: { equipmentId?: string; followUpId?: string }) => api.get<TankCheckStart>('/tools/tank-check/start', from),
  saveTankCheck: (body: RequestOf<typeof SaveTankCheckRequest>) => api.post<SavedTankCheck>('/tools/tank-checks', body),
  tankChecks: (of: { equipmentId?: string; followUpId?: string }) => api.get<{ items: SavedTankCheck[] }>('/tools/tank-checks', of),
  attachTankCheck: (id: string, followUpId: string) => api.post<SavedTankCheck>(`/tools/tank-checks/${id}/attach`, { followUpId }),
  sheets: (equipmentId: string) => api.get<ApplicationSheetHistory>('/tools/application-sheets', { equipmentId }),
  saveSheet: (body: RequestOf<typeof SaveApplicationSheetRequest>) => api.post<ApplicationSheetHistory>('/tools/application-sheets', body),
  sheetPdfUrl: (versionId: string) => `/api/tools/application-sheets/${versionId}/sheet.pdf`,
};
