import { describe, expect, it } from 'vitest';
import {
  actions,
  can,
  landingPageOf,
  mayCorrectOilLogEntry,
  permissionsOf,
  roles,
  type Action,
  type Role,
} from '../../server/contracts/permissions.js';

// The expected grid, written out by hand from the roles in the product brief: a change to the
// table must be a deliberate change to this grid too.
const expected: Record<Role, Action[]> = {
  administrator: ['users.read', 'users.manage', 'sites.read', 'trail.read', 'trail.read-siteless'],
  coordinator: [
    'sites.read',
    'setup.manage',
    'lab.read',
    'lab.write',
    'oil-log.read',
    'oil-log.write',
    'shipments.read',
    'shipments.write',
    'periods.read',
    'periods.compile',
    'periods.sign',
    'periods.amend',
    'follow-ups.read',
    'follow-ups.close',
    'trail.read',
    'tools.use',
    'oil-log.correct-any',
    'shipments.change-after-signed-copy',
    'mail.violations-always',
  ],
  operator: [
    'sites.read',
    'lab.read',
    'oil-log.read',
    'oil-log.write',
    'shipments.read',
    'shipments.write',
    'follow-ups.read',
    'tools.use',
  ],
  auditor: [
    'sites.read',
    'lab.read',
    'oil-log.read',
    'shipments.read',
    'periods.read',
    'follow-ups.read',
    'trail.read',
    'trail.read-siteless',
  ],
};

describe('permission table', () => {
  for (const role of roles) {
    for (const action of actions) {
      const allowed = expected[role].includes(action);
      it(`${allowed ? 'lets' : 'refuses'} ${role} ${action}`, () => {
        expect(can(role, action)).toBe(allowed);
      });
    }
  }

  it('gives a user without a role nothing at all', () => {
    for (const action of actions) expect(can(null, action)).toBe(false);
    expect(permissionsOf(null)).toEqual([]);
  });

  it('never lets an auditor change anything', () => {
    const changing = actions.filter((action) => /\.(write|manage|compile|close|correct-any|change-.*)$/.test(action));
    expect(changing.length).toBeGreaterThan(5);
    for (const action of changing) expect(can('auditor', action)).toBe(false);
  });
});

describe('abilities decided by the table', () => {
  const now = new Date('2026-06-02T12:00:00Z');
  const fresh = { enteredBy: 'op-1', createdAt: '2026-06-02T02:00:00Z' };
  const old = { enteredBy: 'op-1', createdAt: '2026-05-31T12:00:00Z' };

  it('lands the operator on the oil log, the auditor on the reports and everyone else on the overview', () => {
    expect(landingPageOf('operator')).toBe('oil-log');
    expect(landingPageOf('auditor')).toBe('reports');
    for (const role of ['administrator', 'coordinator'] as const) expect(landingPageOf(role)).toBe('overview');
  });

  it('lets an operator correct only their own entry, and only in its first 24 hours', () => {
    expect(mayCorrectOilLogEntry({ id: 'op-1', role: 'operator' }, fresh, now)).toEqual({ allowed: true, reasonRequired: false });
    expect(mayCorrectOilLogEntry({ id: 'op-2', role: 'operator' }, fresh, now).allowed).toBe(false);
    expect(mayCorrectOilLogEntry({ id: 'op-1', role: 'operator' }, old, now).allowed).toBe(false);
  });

  it('lets a coordinator correct any entry, asking a reason once it is older than 24 hours', () => {
    expect(mayCorrectOilLogEntry({ id: 'co-1', role: 'coordinator' }, fresh, now)).toEqual({ allowed: true, reasonRequired: false });
    expect(mayCorrectOilLogEntry({ id: 'co-1', role: 'coordinator' }, old, now)).toEqual({ allowed: true, reasonRequired: true });
  });

  it('never lets an auditor correct an entry', () => {
    expect(mayCorrectOilLogEntry({ id: 'op-1', role: 'auditor' }, fresh, now).allowed).toBe(false);
  });
});
