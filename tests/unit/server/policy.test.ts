import { describe, expect, it } from 'vitest';
import { ACTIONS, ROLES, can, isRole, type Action, type Role } from '../../../server/auth/policy';

// Expected grants written out from product.md "Who uses it, and what each may do".
const EXPECTED: Record<Role, Action[]> = {
  owner: [...ACTIONS],
  // Team, outbox and audit log are the owner's alone (issue 8).
  engineer: ACTIONS.filter(
    (a) => !['team:manage', 'prices:edit', 'outbox:read', 'audit:read'].includes(a),
  ),
  drafter: ['project:read', 'export:read', 'marks:edit'],
  manager: [
    'project:read',
    'export:read',
    'scheme:status',
    'comment:write',
    'prices:edit',
  ],
};

describe('can(role, action)', () => {
  for (const role of ROLES) {
    for (const action of ACTIONS) {
      const allowed = EXPECTED[role].includes(action);
      it(`when ${role} asks for ${action}, then ${allowed ? 'allowed' : 'refused'}`, () => {
        expect(can(role, action)).toBe(allowed);
      });
    }
  }

  it('when the role is drafter or manager, then no geometry, loads or sizes may change', () => {
    for (const role of ['drafter', 'manager'] as const) {
      for (const action of ['project:write', 'scheme:write', 'plan:write'] as const) {
        expect(can(role, action)).toBe(false);
      }
    }
  });

  it('when a value is not a known role, then isRole refuses it', () => {
    expect(isRole('owner')).toBe(true);
    expect(isRole('admin')).toBe(false);
    expect(isRole(undefined)).toBe(false);
  });
});
