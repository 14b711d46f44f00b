import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { OpeningBalanceRequest } from '../../contracts/oil.js';
import { SiteParams } from '../../contracts/params.js';
import { endpoint } from '../../http/endpoint.js';
import { OilOnHandService } from './oil-on-hand.service.js';

/** Mounted at /api/sites/:siteId/oil-on-hand. */
export function oilOnHandRoutes(dataSource: DataSource): Router {
  const router = Router({ mergeParams: true });
  const oilOnHand = new OilOnHandService(dataSource);

  router.get('/', ...endpoint({ action: 'oil-log.read', params: SiteParams }, ({ user, params }) => oilOnHand.get(user, params.siteId)));
  router.put(
    '/opening-balance',
    ...endpoint({ action: 'setup.manage', params: SiteParams, body: OpeningBalanceRequest }, ({ user, params, body }) =>
      oilOnHand.setOpeningBalance(user, params.siteId, body),
    ),
  );

  return router;
}
