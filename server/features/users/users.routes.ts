import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { PageQuery } from '../../contracts/paging.js';
import { CreateUserRequest, UpdateUserRequest } from '../../contracts/users.js';
import { currentUser } from '../../auth/current-user.js';
import { notFound } from '../../errors/app-error.js';
import { requirePermission } from '../../middleware/require-permission.js';
import { validate } from '../../middleware/validate.js';
import { findAllSites } from '../sites/sites.repository.js';
import { findUserView, pageUsers } from './users.repository.js';
import { UsersService } from './users.service.js';

const IdParams = z.object({ id: z.uuid('Not a valid id') });

export function usersRoutes(dataSource: DataSource): Router {
  const router = Router();
  const service = new UsersService(dataSource);

  router.get('/', requirePermission('users.read'), validate({ query: PageQuery }), async (_req, res) => {
    res.json(await pageUsers(dataSource, res.locals.query));
  });

  // Every site, so an administrator can grant access to sites they do not work at themselves.
  router.get('/site-options', requirePermission('users.manage'), async (_req, res) => {
    res.json({ items: (await findAllSites(dataSource)).map(({ id, name, companyName }) => ({ id, name, companyName })) });
  });

  router.get('/:id', requirePermission('users.read'), validate({ params: IdParams }), async (_req, res) => {
    const user = await findUserView(dataSource, res.locals.params.id);
    if (!user) throw notFound('User');
    res.json(user);
  });

  router.post('/', requirePermission('users.manage'), validate({ body: CreateUserRequest }), async (_req, res) => {
    res.status(201).json(await service.create(currentUser(res), res.locals.body));
  });

  router.patch(
    '/:id',
    requirePermission('users.manage'),
    validate({ params: IdParams, body: UpdateUserRequest }),
    async (_req, res) => {
      res.json(await service.update(currentUser(res), res.locals.params.id, res.locals.body));
    },
  );

  return router;
}
