import type { Role } from '../../contracts/permissions.js';

/**
 * The invented demo company. Every name here is made up for the demo; none is a real
 * company, place or person.
 */
export const demoCompany = { name: 'Harlow Vale Precision Parts' };

export const demoSites = [
  {
    key: 'north',
    name: 'Tamsin Creek Works',
    address: '1400 Foundry Row, Tamsin Creek, IL 60999',
    timeZone: 'America/Chicago',
    retentionYears: 5,
    generatorStatus: 'large',
    oilStorageCapacityGallons: 1650,
  },
  {
    key: 'east',
    name: 'Orrin Flats Finishing',
    address: '22 Mill Race Lane, Tamsin Creek, IL 60999',
    timeZone: 'America/Chicago',
    retentionYears: 5,
    generatorStatus: 'small',
    oilStorageCapacityGallons: 880,
  },
] as const;

export type DemoSiteKey = (typeof demoSites)[number]['key'];

export interface DemoPerson {
  email: string;
  name: string;
  role: Role;
  sites: DemoSiteKey[];
  duty: string;
}

export const demoPeople: DemoPerson[] = [
  { email: 'admin@decant.test', name: 'Dana Whitfield', role: 'administrator', sites: ['north', 'east'], duty: 'manages who may sign in' },
  {
    email: 'coordinator@decant.test',
    name: 'Priya Raman',
    role: 'coordinator',
    sites: ['north', 'east'],
    duty: 'EHS coordinator, both sites',
  },
  {
    email: 'coordinator.east@decant.test',
    name: 'Tomas Reyes',
    role: 'coordinator',
    sites: ['east'],
    duty: 'EHS coordinator, Orrin Flats only',
  },
  { email: 'operator@decant.test', name: 'Luis Okafor', role: 'operator', sites: ['north', 'east'], duty: 'logs skimmers and shipments' },
  {
    email: 'auditor@decant.test',
    name: 'Margit Sand',
    role: 'auditor',
    sites: ['north', 'east'],
    duty: 'reads everything, changes nothing',
  },
];

/** The fake identity provider's shared demo password (idp/accounts.ts holds the same). */
export const demoPassword = 'decant-demo';
