import type { DataSource } from 'typeorm';
import type { CreateSiteRequest, UpdateSiteRequest } from '../../contracts/setup.js';
import type { SiteSummary } from '../../contracts/sites.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteVisible } from '../../auth/site-access.js';
import { uniquely } from '../../db/uniquely.js';
import { notFound } from '../../errors/app-error.js';
import { createTraced, deleteTraced, updateTraced } from '../../kernel/trail/traced-writes.js';
import { siteTarget } from './site.views.js';
import { companyForNewSite, findSites, grantSite, revokeSiteFromEveryone } from './sites.repository.js';

/** The facilities: each a time zone, a retention period and the manifest rule it follows. */
export class SitesService {
  constructor(private readonly dataSource: DataSource) {}

  list(user: CurrentUser): Promise<SiteSummary[]> {
    return findSites(this.dataSource, user.siteIds);
  }

  async get(user: CurrentUser, id: string): Promise<SiteSummary> {
    assertSiteVisible(user, id, 'Site');
    const [site] = await findSites(this.dataSource, [id]);
    if (!site) throw notFound('Site');
    return site;
  }

  /** A new site joins the company of the coordinator's sites; its creator gets access to it. */
  async create(user: CurrentUser, request: CreateSiteRequest): Promise<SiteSummary> {
    const companyId = await companyForNewSite(this.dataSource.manager, user.siteIds);
    const created = await uniquely(
      () =>
        createTraced(
          this.dataSource,
          user,
          siteTarget,
          { ...request, companyId },
          {
            afterWrite: (manager, row) => grantSite(manager, user.id, String(row.id)),
          },
        ),
      'name',
      'A site with this name already exists',
    );
    return (await findSites(this.dataSource, [created.id]))[0]!;
  }

  async update(user: CurrentUser, id: string, request: UpdateSiteRequest): Promise<SiteSummary> {
    assertSiteVisible(user, id, 'Site');
    await uniquely(() => updateTraced(this.dataSource, user, siteTarget, id, request), 'name', 'A site with this name already exists');
    return (await findSites(this.dataSource, [id]))[0]!;
  }

  /** Only a site with no records left: every table that refers to a site refuses the delete. */
  async remove(user: CurrentUser, id: string): Promise<void> {
    assertSiteVisible(user, id, 'Site');
    await deleteTraced(this.dataSource, user, siteTarget, id, (manager) => revokeSiteFromEveryone(manager, id));
  }
}
