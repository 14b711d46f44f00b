import type { ImportRunView } from '@contracts/imports.js';
import { api } from './client';

export type { ImportRunView };

export const importRunsApi = {
  get: (id: string) => api.get<ImportRunView>(`/import-runs/${id}`),
};
