import type { DataSource } from 'typeorm';
import type { OilOnHandView, OpeningBalanceRequest } from '../../contracts/oil.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteVisible } from '../../auth/site-access.js';
import { oilOnHand } from '../../domain/oil-collection.js';
import { convert } from '../../domain/units.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { findOpeningBalance, oilBalanceInput, saveOpeningBalance } from './oil-on-hand.repository.js';

/** Oil on hand at a site: opening balance + collected − shipped, against its storage capacity. */
export class OilOnHandService {
  constructor(private readonly dataSource: DataSource) {}

  async get(user: CurrentUser, siteId: string): Promise<OilOnHandView> {
    assertSiteVisible(user, siteId, 'Site');
    const { openingOn, ...input } = (await oilBalanceInput(this.dataSource, siteId))!;
    const balance = oilOnHand(input);
    return { ...input, openingOn, onHandLitres: balance.litres, flags: balance.flags };
  }

  async setOpeningBalance(user: CurrentUser, siteId: string, request: OpeningBalanceRequest): Promise<void> {
    assertSiteVisible(user, siteId, 'Site');
    await this.dataSource.transaction(async (manager) => {
      const before = await findOpeningBalance(manager, siteId);
      const after = { litres: convert(request.volume, request.unit, 'L')!, on: request.on };
      await saveOpeningBalance(manager, siteId, after);
      await recordTrail(manager, user, { action: 'update', entity: 'oil-opening-balance', entityId: siteId, siteId, before, after });
    });
  }
}
