import type { OilOnHandView, OpeningBalanceRequest } from '@contracts/oil.js';
import type { CreateSiteRequest, UpdateSiteRequest } from '@contracts/setup.js';
import type { SiteSummary } from '@contracts/sites.js';
import { api, type RequestOf } from './client';

export const sitesApi = {
  create: (body: RequestOf<typeof CreateSiteRequest>) => api.post<SiteSummary>('/sites', body),
  update: (id: string, body: RequestOf<typeof UpdateSiteRequest>) => api.patch<SiteSummary>(`/sites/${id}`, body),
  oilOnHand: (siteId: string) => api.get<OilOnHandView>(`/sites/${siteId}/oil-on-hand`),
  setOpeningBalance: (siteId: string, body: RequestOf<typeof OpeningBalanceRequest>) =>
    api.put<void>(`/sites/${siteId}/oil-on-hand/opening-balance`, body),
};
