import type { SkimmerFitView, TankCheckRequest, TankCheckView } from '@contracts/tools.js';
import { api, type RequestOf } from './client';

export const toolsApi = {
  skimmerFit: (siteId: string) => api.get<SkimmerFitView>('/tools/skimmer-fit', { siteId }),
  tankCheck: (body: RequestOf<typeof TankCheckRequest>) => api.post<TankCheckView>('/tools/tank-check', body),
};
