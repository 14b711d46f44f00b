import { describe, expect, it } from 'vitest';
import { actions, can, permissionsOf, roles, type Action, type Role } from '../../server/contracts/permissions.js';

// The expected grid, written out by hand from the roles in the product brief: a change to the
// table must be a deliberate change to this grid too.
const expected: Record<Role, Action[]> = {
  administrator: ['users.read', 'users.manage', 'sites.read', 'trail.read'],
  coordinator: [
    'sites.read', 'setup.manage', 'lab.read', 'lab.write', 'oil-log.read', 'oil-log.write', 'shipments.read',
    'shipments.write', 'periods.read', 'periods.compile', 'follow-ups.read', 'follow-ups.close', 'trail.read', 'tools.use',
  ],
  operator: ['sites.read', 'lab.read', 'oil-log.read', 'oil-log.write', 'shipments.read', 'shipments.write', 'follow-ups.read', 'tools.use'],
  auditor: ['sites.read', 'lab.read', 'oil-log.read', 'shipments.read', 'periods.read', 'follow-ups.read', 'trail.read', 'tools.use'],
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
    const changing = actions.filter((action) => /\.(write|manage|compile|close)$/.test(action));
    expect(changing.length).toBeGreaterThan(5);
    for (const action of changing) expect(can('auditor', action)).toBe(false);
  });
});
