import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { IdParams } from '../../contracts/params.js';
import { CreateUserRequest, UpdateUserRequest, UserListQuery } from '../../contracts/users.js';
import { endpoint } from '../../http/endpoint.js';
import { UsersService } from './users.service.js';

export function usersRoutes(dataSource: DataSource): Router {
  const router = Router();
  const users = new UsersService(dataSource);

  router.get('/', ...endpoint({ action: 'users.read', query: UserListQuery }, ({ query }) => users.list(query)));
  router.get('/site-options', ...endpoint({ action: 'users.manage' }, () => users.siteOptions()));
  router.get('/:id', ...endpoint({ action: 'users.read', params: IdParams }, ({ params }) => users.get(params.id)));
  router.post(
    '/',
    ...endpoint({ action: 'users.manage', body: CreateUserRequest, status: 201 }, ({ user, body }) => users.create(user, body)),
  );
  router.patch(
    '/:id',
    ...endpoint({ action: 'users.manage', params: IdParams, body: UpdateUserRequest }, ({ user, params, body }) =>
      users.update(user, params.id, body),
    ),
  );

  return router;
}
