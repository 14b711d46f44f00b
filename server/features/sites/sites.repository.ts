import type { DataSource, EntityManager } from 'typeorm';
import type { SiteSummary } from '../../contracts/sites.js';
import { UserSite } from '../../kernel/people/user-site.entity.js';
import { Company } from '../../kernel/sites/company.entity.js';
import { Site } from '../../kernel/sites/site.entity.js';

type Db = DataSource | EntityManager;

const toSummary = (site: Site & { company: Company }): SiteSummary => ({
  id: site.id,
  companyName: site.company.name,
  name: site.name,
  address: site.address,
  timeZone: site.timeZone,
  retentionYears: site.retentionYears,
  generatorStatus: site.generatorStatus,
  manifestRule: site.manifestRule,
  oilStorageCapacityGallons: site.oilStorageCapacityGallons,
});

function sitesWithCompany(db: Db) {
  return db.getRepository(Site).createQueryBuilder('site').innerJoinAndSelect('site.company', 'company').orderBy('site.name');
}

export async function findSites(db: Db, ids: string[]): Promise<SiteSummary[]> {
  if (ids.length === 0) return [];
  const sites = await sitesWithCompany(db).where('site.id = ANY(:ids)', { ids }).getMany();
  return sites.map((site) => toSummary(site as Site & { company: Company }));
}

export async function findAllSites(db: Db): Promise<SiteSummary[]> {
  return (await sitesWithCompany(db).getMany()).map((site) => toSummary(site as Site & { company: Company }));
}

/** The company a new site joins: that of the creator's sites, else the first company. */
export async function companyForNewSite(db: Db, creatorSiteIds: string[]): Promise<string> {
  const own =
    creatorSiteIds.length > 0
      ? await db.getRepository(Site).findOne({ where: { id: creatorSiteIds[0] }, select: { companyId: true } })
      : null;
  if (own) return own.companyId;
  const [first] = await db.getRepository(Company).find({ order: { createdAt: 'ASC' }, take: 1 });
  return first!.id;
}

export async function grantSite(manager: EntityManager, userId: string, siteId: string): Promise<void> {
  await manager.insert(UserSite, { userId, siteId });
}

export async function revokeSiteFromEveryone(manager: EntityManager, siteId: string): Promise<void> {
  await manager.delete(UserSite, { siteId });
}
