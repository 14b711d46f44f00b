import type { DataSource, EntityManager } from 'typeorm';

import type { EquipmentFacts } from '../../contracts/application-sheet.js';

export type { EquipmentFacts };
type Db = DataSource | EntityManager;

export async function equipmentFacts(db: Db, id: string): Promise<EquipmentFacts | null> {
  // Raw SQL: the equipment with its site, company and discharge point in one read.
  const [row] = await db.query(
    `SELECT e.id, e.site_id, s.name AS site, c.name AS company, e.name, e.kind, e.serves, e.rated_capacity::float8 AS rated_capacity,
            e.rated_unit, e.medium_material, d.code AS point_code
       FROM equipment e JOIN site s ON s.id = e.site_id JOIN company c ON c.id = s.company_id
       LEFT JOIN discharge_point d ON d.id = e.discharge_point_id
      WHERE e.id = $1`,
    [id],
  );
  if (!row) return null;
  return {
    id: row.id,
    siteId: row.site_id,
    site: row.site,
    company: row.company,
    name: row.name,
    kind: row.kind,
    serves: row.serves,
    ratedCapacity: row.rated_capacity,
    ratedUnit: row.rated_unit,
    mediumMaterial: row.medium_material,
    pointCode: row.point_code,
  };
}
