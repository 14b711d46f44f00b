import type { TankCheckRequest, TankCheckView } from '@contracts/tools.js';
import { api, type RequestOf } from './client';

export const toolsApi = {
  tankCheck: (body: RequestOf<typeof TankCheckRequest>) => api.post<TankCheckView>('/tools/tank-check', body),
};
