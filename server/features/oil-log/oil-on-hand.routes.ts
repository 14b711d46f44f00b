import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { isoDate } from '../../contracts/fields.js';
import { currentUser } from '../../auth/current-user.js';
import { assertSiteVisible } from '../../auth/site-access.js';
import { oilOnHand } from '../../domain/oil-collection.js';
import { convert } from '../../domain/units.js';
import { requirePermission } from '../../middleware/require-permission.js';
import { validate } from '../../middleware/validate.js';
import { recordTrail } from '../trail/trail.js';
import { oilBalanceInput } from './oil-on-hand.repository.js';

const SiteParams = z.object({ siteId: z.uuid('Not a valid id') });
const OpeningBalance = z.object({ volume: z.number().finite().min(0).max(10_000_000), unit: z.enum(['gal', 'L']), on: isoDate });

/** Mounted at /api/sites/:siteId/oil-on-hand: opening balance + collected − shipped, against capacity. */
export function oilOnHandRoutes(dataSource: DataSource): Router {
  const router = Router({ mergeParams: true });

  router.get('/', requirePermission('oil-log.read'), validate({ params: SiteParams }), async (_req, res) => {
    const { siteId } = res.locals.params;
    assertSiteVisible(currentUser(res), siteId, 'Site');
    const { openingOn, ...input } = (await oilBalanceInput(dataSource, siteId))!;
    const balance = oilOnHand(input);
    res.json({ ...input, openingOn, onHandLitres: balance.litres, flags: balance.flags });
  });

  router.put('/opening-balance', requirePermission('setup.manage'), validate({ params: SiteParams, body: OpeningBalance }), async (_req, res) => {
    const { siteId } = res.locals.params;
    const user = currentUser(res);
    assertSiteVisible(user, siteId, 'Site');
    const body = res.locals.body as z.infer<typeof OpeningBalance>;
    await dataSource.transaction(async (manager) => {
      const [before] = await manager.query('SELECT oil_opening_balance_litres, oil_opening_balance_on FROM site WHERE id = $1', [siteId]);
      const litres = convert(body.volume, body.unit, 'L');
      await manager.query('UPDATE site SET oil_opening_balance_litres = $2, oil_opening_balance_on = $3, updated_at = now() WHERE id = $1', [siteId, litres, body.on]);
      await recordTrail(manager, user, {
        action: 'update', entity: 'oil-opening-balance', entityId: siteId, siteId,
        before: { litres: Number(before.oil_opening_balance_litres), on: before.oil_opening_balance_on }, after: { litres, on: body.on },
      });
    });
    res.status(204).end();
  });

  return router;
}
