import { can } from '../../contracts/permissions.js';
import type { DataSource, EntityManager } from 'typeorm';
import type { UserListQuery } from '../../contracts/users.js';
import type { CreateUserRequest, UpdateUserRequest, UserView } from '../../contracts/users.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { conflict, invalid, notFound } from '../../errors/app-error.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { User } from '../../kernel/people/user.entity.js';
import { findAllSites } from '../sites/sites.repository.js';
import { countExistingSites, findUserView, pageUsers, replaceUserSites } from './users.repository.js';

/** The administrator's management of who may sign in, with which role, at which sites. */
export class UsersService {
  constructor(private readonly dataSource: DataSource) {}

  list(query: UserListQuery) {
    return pageUsers(this.dataSource, query);
  }

  async get(id: string): Promise<UserView> {
    const user = await findUserView(this.dataSource, id);
    if (!user) throw notFound('User');
    return user;
  }

  /** Every site, so an administrator can grant access to sites they do not work at themselves. */
  async siteOptions() {
    return { items: (await findAllSites(this.dataSource)).map(({ id, name, companyName }) => ({ id, name, companyName })) };
  }

  async create(actor: CurrentUser, request: CreateUserRequest): Promise<UserView> {
    return this.dataSource.transaction(async (manager) => {
      if (await manager.existsBy(User, { email: request.email })) {
        throw conflict('A user with this e-mail already exists', { email: 'already registered' });
      }
      await this.assertSitesExist(manager, request.siteIds);
      const user = await manager.save(
        User,
        manager.create(User, { email: request.email, name: request.name, role: request.role, active: request.active }),
      );
      await replaceUserSites(manager, user.id, request.siteIds);
      const after = (await findUserView(manager, user.id))!;
      await recordTrail(manager, actor, { action: 'create', entity: 'user', entityId: user.id, after });
      return after;
    });
  }

  async update(actor: CurrentUser, id: string, request: UpdateUserRequest): Promise<UserView> {
    return this.dataSource.transaction(async (manager) => {
      const before = await findUserView(manager, id);
      if (!before) throw notFound('User');
      if (id === actor.id && ((request.role !== undefined && !can(request.role, 'users.manage')) || request.active === false)) {
        // Otherwise the last administrator could lock everyone out of user management.
        throw invalid({ role: 'You cannot remove your own administrator access' });
      }
      if (request.siteIds) await this.assertSitesExist(manager, request.siteIds);
      const { siteIds, ...columns } = request;
      if (Object.keys(columns).length > 0) await manager.update(User, { id }, columns);
      if (siteIds) await replaceUserSites(manager, id, siteIds);
      const after = (await findUserView(manager, id))!;
      await recordTrail(manager, actor, { action: 'update', entity: 'user', entityId: id, before, after });
      return after;
    });
  }

  private async assertSitesExist(manager: EntityManager, siteIds: string[]): Promise<void> {
    if ((await countExistingSites(manager, siteIds)) !== new Set(siteIds).size) {
      throw invalid({ siteIds: 'One or more sites do not exist' });
    }
  }
}
