import { In, type DataSource } from 'typeorm';
import { Company } from '../../kernel/sites/company.entity.js';
import { Site } from '../../kernel/sites/site.entity.js';
import { UserSite } from '../../kernel/people/user-site.entity.js';
import { User } from '../../kernel/people/user.entity.js';
import { demoCompany, demoPeople, demoSites } from './demo-scenario.js';
import { seedLab } from './seed-lab.js';
import { seedEquipmentSheets } from './seed-equipment-sheets.js';
import { seedOil } from './seed-oil.js';
import { seedFlowsAndPeriods } from './seed-periods.js';
import { seedSignOff } from './seed-sign-off.js';
import { seedSetup } from './seed-setup.js';
import { recordSeedInTrail } from './seed-trail.js';

/**
 * When the demo may be added: `when-empty` (npm start in demo mode, npm test) only to a database
 * that holds no company and no person yet; `explicit` (npm run db:seed) beside other data too.
 */
export type SeedMode = 'when-empty' | 'explicit';

export type SeedOutcome = 'seeded' | 'not-empty' | 'already-there';

/**
 * Adds the demo company, its two sites, people and 18 months of records, all in one
 * transaction, and writes each record it made to the trail as the seed. It only ever creates:
 * it runs when the demo company is absent, touches no row outside the demo sites and never
 * updates a record that existed before it started.
 */
/**
 * `signOff`: sign the demo's finished periods (as on a real site). The server tests' database
 * leaves them as drafts, because those tests write into the demo's past months.
 */
export async function seedDemo(dataSource: DataSource, mode: SeedMode, options: { signOff?: boolean } = {}): Promise<SeedOutcome> {
  options = { signOff: true, ...options };
  return dataSource.transaction(async (manager) => {
    // The seed writes its own trail entries (seed-trail.ts), like the app.
    await manager.query(`SET LOCAL decant.via_app = 'on'`);
    if (await manager.existsBy(Company, { name: demoCompany.name })) return 'already-there';
    if (mode === 'when-empty' && ((await manager.count(Company)) > 0 || (await manager.count(User)) > 0)) return 'not-empty';
    const taken = await manager.findBy(User, { email: In(demoPeople.map((person) => person.email)) });
    if (taken.length > 0) {
      throw new Error(`The demo seed adds nothing: ${taken.map((user) => user.email).join(', ')} already belong to people here`);
    }
    const company = await manager.save(Company, manager.create(Company, demoCompany));

    const sitesByKey = new Map<string, Site>();
    for (const { key, ...fields } of demoSites) {
      sitesByKey.set(key, await manager.save(Site, manager.create(Site, { ...fields, companyId: company.id })));
    }

    for (const person of demoPeople) {
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
    await seedEquipmentSheets(manager, [north.id, east.id], coordinator.id);
    await seedFlowsAndPeriods(
      manager,
      [
        { id: north.id, timeZone: north.timeZone, outfall: 'OF-001', gallonsPerDay: 35000 },
        { id: east.id, timeZone: east.timeZone, outfall: 'OF-002', gallonsPerDay: 15000 },
      ],
      coordinator,
    );
    await recordSeedInTrail(manager, [north.id, east.id]);
    if (options.signOff) await seedSignOff(manager, [north.id, east.id], coordinator);
    return 'seeded';
  });
}
