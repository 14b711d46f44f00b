import type { DataSource, EntityManager } from 'typeorm';
import type { SiteSummary } from '../../contracts/sites.js';

const selectSites = `
  SELECT s.id, c.name AS company_name, s.name, s.address, s.time_zone, s.retention_years,
         s.generator_status, s.manifest_rule, s.oil_storage_capacity_gallons
    FROM site s JOIN company c ON c.id = s.company_id`;

interface SiteRow {
  id: string;
  company_name: string;
  name: string;
  address: string;
  time_zone: string;
  retention_years: number;
  generator_status: SiteSummary['generatorStatus'];
  manifest_rule: SiteSummary['manifestRule'];
  oil_storage_capacity_gallons: string | null;
}

const toSummary = (row: SiteRow): SiteSummary => ({
  id: row.id,
  companyName: row.company_name,
  name: row.name,
  address: row.address,
  timeZone: row.time_zone,
  retentionYears: row.retention_years,
  generatorStatus: row.generator_status,
  manifestRule: row.manifest_rule,
  oilStorageCapacityGallons: row.oil_storage_capacity_gallons === null ? null : Number(row.oil_storage_capacity_gallons),
});

export async function findSites(dataSource: DataSource, ids: string[]): Promise<SiteSummary[]> {
  if (ids.length === 0) return [];
  const rows: SiteRow[] = await dataSource.query(`${selectSites} WHERE s.id = ANY($1::uuid[]) ORDER BY s.name`, [ids]);
  return rows.map(toSummary);
}

export async function findAllSites(dataSource: DataSource): Promise<SiteSummary[]> {
  const rows: SiteRow[] = await dataSource.query(`${selectSites} ORDER BY s.name`);
  return rows.map(toSummary);
}

/** The company a new site joins: that of the creator's sites, else the first company. */
export async function companyForNewSite(manager: EntityManager, creatorSiteIds: string[]): Promise<string> {
  const [row]: Array<{ company_id: string }> = await manager.query(
    `SELECT coalesce((SELECT company_id FROM site WHERE id = ANY($1::uuid[]) LIMIT 1),
                     (SELECT id FROM company ORDER BY created_at LIMIT 1)) AS company_id`,
    [creatorSiteIds],
  );
  return row!.company_id;
}

export async function grantSite(manager: EntityManager, userId: string, siteId: string): Promise<void> {
  await manager.query('INSERT INTO user_site (user_id, site_id) VALUES ($1, $2)', [userId, siteId]);
}

export async function revokeSiteFromEveryone(manager: EntityManager, siteId: string): Promise<void> {
  await manager.query('DELETE FROM user_site WHERE site_id = $1', [siteId]);
}
