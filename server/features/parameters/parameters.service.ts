import type { DataSource } from 'typeorm';
import type { CreateParameterRequest, UpdateParameterRequest } from '../../contracts/setup.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteAllowed } from '../../auth/site-access.js';
import { uniquely } from '../../db/uniquely.js';
import type { Parameter } from './parameter.entity.js';
import { forbidden } from '../../errors/app-error.js';
import { createTraced, deleteTraced, updateTraced } from '../../kernel/trail/traced-writes.js';
import { findParameters, parameterTarget, type ParameterView } from './parameters.repository.js';

const duplicate = 'A parameter with this code already exists';

/** The parameter catalogue: shared entries (no site, seeded) plus a site's own additions. */
export class ParametersService {
  constructor(private readonly dataSource: DataSource) {}

  list(user: CurrentUser, siteId: string | undefined): Promise<ParameterView[]> {
    return findParameters(this.dataSource, user.siteIds, siteId ?? null);
  }

  create(user: CurrentUser, request: CreateParameterRequest): Promise<ParameterView> {
    // A coordinator adds to their own site's catalogue; the shared catalogue is seeded data.
    if (!request.siteId) throw forbidden('Add a parameter to one of your sites (siteId)');
    assertSiteAllowed(user, request.siteId);
    return uniquely(() => createTraced(this.dataSource, user, parameterTarget, request), 'code', duplicate);
  }

  update(user: CurrentUser, id: string, request: UpdateParameterRequest): Promise<ParameterView> {
    return uniquely(
      () => updateTraced(this.dataSource, user, parameterTarget, id, request, async (_manager, before) => assertOwnSiteEntry(user, before)),
      'code',
      duplicate,
    );
  }

  async remove(user: CurrentUser, id: string): Promise<void> {
    await deleteTraced(this.dataSource, user, parameterTarget, id, async (_manager, before) => assertOwnSiteEntry(user, before));
  }
}

function assertOwnSiteEntry(user: CurrentUser, before: Parameter): void {
  if (!before.siteId) throw forbidden('The shared catalogue cannot be changed here');
  assertSiteAllowed(user, before.siteId);
}
