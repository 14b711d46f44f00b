import type { DataSource } from 'typeorm';
import type { CreateDischargePointRequest, DischargePoint, UpdateDischargePointRequest } from '../../contracts/setup.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteVisible } from '../../auth/site-access.js';
import { uniquely } from '../../db/uniquely.js';
import { notFound } from '../../errors/app-error.js';
import { createTraced, deleteTraced, updateTraced } from '../../kernel/trail/traced-writes.js';
import { dischargePointTarget as target, findDischargePoints } from './discharge-points.repository.js';

const duplicateCode = 'This site already has a discharge point with this code';

/** Outfalls and internal sampling points of a site. */
export class DischargePointsService {
  constructor(private readonly dataSource: DataSource) {}

  list(user: CurrentUser, siteId: string): Promise<DischargePoint[]> {
    assertSiteVisible(user, siteId, 'Site');
    return findDischargePoints(this.dataSource, siteId);
  }

  create(user: CurrentUser, siteId: string, request: CreateDischargePointRequest): Promise<DischargePoint> {
    assertSiteVisible(user, siteId, 'Site');
    return uniquely(() => createTraced(this.dataSource, user, target, { ...request, siteId }), 'code', duplicateCode);
  }

  update(user: CurrentUser, siteId: string, id: string, request: UpdateDischargePointRequest): Promise<DischargePoint> {
    assertSiteVisible(user, siteId, 'Site');
    return uniquely(
      () =>
        updateTraced(this.dataSource, user, target, id, request, async (_manager, before) => {
          if (before.siteId !== siteId) throw notFound('Discharge point');
        }),
      'code',
      duplicateCode,
    );
  }

  async remove(user: CurrentUser, siteId: string, id: string): Promise<void> {
    assertSiteVisible(user, siteId, 'Site');
    await deleteTraced(this.dataSource, user, target, id, async (_manager, before) => {
      if (before.siteId !== siteId) throw notFound('Discharge point');
    });
  }
}
