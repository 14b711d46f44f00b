import type { DataSource } from 'typeorm';
import type { CreateEquipmentRequest, EquipmentView, UpdateEquipmentRequest } from '../../contracts/oil.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteAllowed, assertSiteVisible } from '../../auth/site-access.js';
import { uniquely } from '../../db/uniquely.js';
import { siteToday } from '../../kernel/site-today.js';
import { createTraced, deleteTraced, updateTraced } from '../../kernel/trail/traced-writes.js';
import { invalid } from '../../errors/app-error.js';
import { equipmentTarget as target, findEquipment, findEquipmentSiteId, pointIsAtSite } from './equipment.repository.js';

const duplicate = 'This site already has equipment with this name';

/** Skimmers, separators and sumps. Retired (inactive), never deleted while records refer to them. */
export class EquipmentService {
  constructor(private readonly dataSource: DataSource) {}

  async list(user: CurrentUser, siteId: string): Promise<EquipmentView[]> {
    assertSiteAllowed(user, siteId);
    return findEquipment(this.dataSource, { siteIds: [siteId] }, await siteToday(this.dataSource, siteId));
  }

  async get(user: CurrentUser, id: string): Promise<EquipmentView> {
    const siteId = await findEquipmentSiteId(this.dataSource, id);
    assertSiteVisible(user, siteId, 'Equipment');
    const [view] = await findEquipment(this.dataSource, { siteIds: [siteId!], id }, await siteToday(this.dataSource, siteId!));
    return view!;
  }

  async create(user: CurrentUser, request: CreateEquipmentRequest) {
    assertSiteAllowed(user, request.siteId);
    await this.assertPointAtSite(request.dischargePointId, request.siteId);
    return uniquely(() => createTraced(this.dataSource, user, target, request), 'name', duplicate);
  }

  update(user: CurrentUser, id: string, request: UpdateEquipmentRequest) {
    return uniquely(
      () =>
        updateTraced(this.dataSource, user, target, id, request, async (_m, before) => {
          assertSiteVisible(user, before.siteId as string, 'Equipment');
          await this.assertPointAtSite(request.dischargePointId, before.siteId as string);
        }),
      'name',
      duplicate,
    );
  }

  private async assertPointAtSite(pointId: string | null | undefined, siteId: string): Promise<void> {
    if (pointId && !(await pointIsAtSite(this.dataSource, pointId, siteId))) {
      throw invalid({ dischargePointId: 'No such discharge point at this site' });
    }
  }

  async remove(user: CurrentUser, id: string): Promise<void> {
    await deleteTraced(this.dataSource, user, target, id, async (_m, before) =>
      assertSiteVisible(user, before.siteId as string, 'Equipment'),
    );
  }
}
