import type { DataSource } from 'typeorm';
import { permissionsOf } from '../../contracts/permissions.js';
import type { Me, UpdatePreferencesRequest } from '../../contracts/users.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { User } from '../../kernel/people/user.entity.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { findSites } from '../sites/sites.repository.js';

/** The signed-in person's own profile, sites, permissions and preferences. */
export class MeService {
  constructor(private readonly dataSource: DataSource) {}

  async get(user: CurrentUser): Promise<Me> {
    const { unitSystem } = await this.dataSource.manager.findOneByOrFail(User, { id: user.id });
    return {
      user: { id: user.id, email: user.email, name: user.name, role: user.role, unitSystem },
      sites: await findSites(this.dataSource, user.siteIds),
      permissions: permissionsOf(user.role),
    };
  }

  /** The user's own choice of units for volumes (US gallons or litres). */
  async updatePreferences(user: CurrentUser, request: UpdatePreferencesRequest): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const before = await manager.findOneByOrFail(User, { id: user.id });
      await manager.update(User, { id: user.id }, { unitSystem: request.unitSystem });
      await recordTrail(manager, user, {
        action: 'update',
        entity: 'preferences',
        entityId: user.id,
        before: { unitSystem: before.unitSystem },
        after: request,
      });
    });
  }
}
