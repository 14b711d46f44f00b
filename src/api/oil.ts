import type { Flag } from '@contracts/flags.js';
import type { EquipmentView, OilLogEntryView, UpkeepCheckView, upkeepItems } from '@contracts/oil.js';
import type { Page } from '@contracts/paging.js';
import type { ShipmentView } from '@contracts/shipments.js';
import { api, type Query } from './client';

export interface OilOnHand {
  openingLitres: number;
  openingOn: string | null;
  collectedLitres: number;
  shippedLitres: number;
  capacityGallons: number | null;
  onHandLitres: number;
  flags: Flag[];
}

export const oilApi = {
  equipment: (siteId: string) => api.get<{ items: EquipmentView[] }>('/equipment', { siteId }),
  equipmentOne: (id: string) => api.get<EquipmentView>(`/equipment/${id}`),
  entries: (query: Query) => api.get<Page<OilLogEntryView>>('/oil-log', query),
  totals: (query: Query) =>
    api.get<{ by: string; items: Array<{ period: string; litres: number; entries: number }> }>('/oil-log/totals', query),
  log: (body: unknown) => api.post<OilLogEntryView>('/oil-log', body),
  upkeepChecks: (equipmentId: string) =>
    api.get<{ items: UpkeepCheckView[]; checklist: typeof upkeepItems }>('/upkeep-checks', { equipmentId }),
  recordUpkeep: (body: unknown) => api.post<UpkeepCheckView>('/upkeep-checks', body),
  oilOnHand: (siteId: string) => api.get<OilOnHand>(`/sites/${siteId}/oil-on-hand`),
  shipments: (query: Query) => api.get<Page<ShipmentView>>('/shipments', query),
  createShipment: (body: unknown) => api.post<ShipmentView>('/shipments', body),
  updateShipment: (id: string, body: unknown) => api.patch<ShipmentView>(`/shipments/${id}`, body),
  setUnitSystem: (unitSystem: 'us' | 'metric') => api.patch<void>('/me/preferences', { unitSystem }),
};
