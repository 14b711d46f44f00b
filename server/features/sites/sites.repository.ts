import type { DataSource } from 'typeorm';
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
