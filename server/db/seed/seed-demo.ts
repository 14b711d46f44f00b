import type { DataSource } from 'typeorm';
import { Company } from '../../kernel/sites/company.entity.js';
import { Site } from '../../kernel/sites/site.entity.js';
import { UserSite } from '../../kernel/people/user-site.entity.js';
import { User } from '../../kernel/people/user.entity.js';
import { demoCompany, demoPeople, demoSites } from './demo-scenario.js';
import { seedLab } from './seed-lab.js';
import { seedOil } from './seed-oil.js';
import { seedFlowsAndPeriods } from './seed-periods.js';
import { seedSetup } from './seed-setup.js';

/**
 * Loads the demo scenario. Idempotent: every record is found by its natural key first, so a
 * second run adds nothing. It never overwrites what a user changed through the app.
 */
export async function seedDemo(dataSource: DataSource): Promise<void> {
  await dataSource.transaction(async (manager) => {
    let company = await manager.findOneBy(Company, { name: demoCompany.name });
    company ??= await manager.save(Company, manager.create(Company, demoCompany));

    const sitesByKey = new Map<string, Site>();
    for (const { key, ...fields } of demoSites) {
      let site = await manager.findOneBy(Site, { companyId: company.id, name: fields.name });
      site ??= await manager.save(Site, manager.create(Site, { ...fields, companyId: company.id }));
      sitesByKey.set(key, site);
    }

    for (const person of demoPeople) {
      const existing = await manager.findOneBy(User, { email: person.email });
      if (existing) continue;
      const user = await manager.save(User, manager.create(User, { email: person.email, name: person.name, role: person.role }));
      await manager.insert(
        UserSite,
        person.sites.map((key) => ({ userId: user.id, siteId: sitesByKey.get(key)!.id })),
      );
    }

    const north = sitesByKey.get('north')!;
    const east = sitesByKey.get('east')!;
    await seedSetup(manager, { north: north.id, east: east.id });
    const coordinator = (await manager.findOneBy(User, { email: 'coordinator@decant.test' }))!;
    await seedLab(
      dataSource,
      manager,
      [
        { key: 'north', id: north.id, name: north.name, timeZone: north.timeZone, outfall: 'OF-001' },
        { key: 'east', id: east.id, name: east.name, timeZone: east.timeZone, outfall: 'OF-002' },
      ],
      { id: coordinator.id, email: coordinator.email, name: coordinator.name, role: 'coordinator', siteIds: [north.id, east.id] },
    );
    const operator = (await manager.findOneBy(User, { email: 'operator@decant.test' }))!;
    await seedOil(
      manager,
      [
        { key: 'north', id: north.id, timeZone: north.timeZone },
        { key: 'east', id: east.id, timeZone: east.timeZone },
      ],
      operator.id,
    );
    await seedFlowsAndPeriods(
      manager,
      [
        { id: north.id, timeZone: north.timeZone, outfall: 'OF-001', gallonsPerDay: 35000 },
        { id: east.id, timeZone: east.timeZone, outfall: 'OF-002', gallonsPerDay: 15000 },
      ],
      coordinator,
    );
  });
}
