import type { Parameter } from '@contracts/setup.js';
import { api } from './client';

export const parametersApi = {
  list: (siteId?: string) => api.get<{ items: Parameter[] }>('/parameters', { siteId }),
};
