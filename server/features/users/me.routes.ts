import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { permissionsOf } from '../../contracts/permissions.js';
import type { Me } from '../../contracts/users.js';
import { currentUser } from '../../auth/current-user.js';
import { findSites } from '../sites/sites.repository.js';

export function meRoutes(dataSource: DataSource): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    const user = currentUser(res);
    const body: Me = {
      user: { id: user.id, email: user.email, name: user.name, role: user.role },
      sites: await findSites(dataSource, user.siteIds),
      permissions: permissionsOf(user.role),
    };
    res.json(body);
  });
  return router;
}
