import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { permissionsOf } from '../../contracts/permissions.js';
import { UpdatePreferencesRequest, type Me } from '../../contracts/users.js';
import { validate } from '../../middleware/validate.js';
import { recordTrail } from '../trail/trail.js';
import { currentUser } from '../../auth/current-user.js';
import { findSites } from '../sites/sites.repository.js';

export function meRoutes(dataSource: DataSource): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    const user = currentUser(res);
    const [{ unit_system: unitSystem }] = await dataSource.query('SELECT unit_system FROM app_user WHERE id = $1', [user.id]);
    const body: Me = {
      user: { id: user.id, email: user.email, name: user.name, role: user.role, unitSystem },
      sites: await findSites(dataSource, user.siteIds),
      permissions: permissionsOf(user.role),
    };
    res.json(body);
  });

  // The user's own choice of units for volumes (US gallons or litres); data stay in litres.
  router.patch('/preferences', validate({ body: UpdatePreferencesRequest }), async (_req, res) => {
    const user = currentUser(res);
    await dataSource.transaction(async (manager) => {
      const [before] = await manager.query('SELECT unit_system FROM app_user WHERE id = $1', [user.id]);
      await manager.query('UPDATE app_user SET unit_system = $2, updated_at = now() WHERE id = $1', [user.id, res.locals.body.unitSystem]);
      await recordTrail(manager, user, {
        action: 'update', entity: 'preferences', entityId: user.id, before: { unitSystem: before.unit_system }, after: res.locals.body,
      });
    });
    res.status(204).end();
  });
  return router;
}
