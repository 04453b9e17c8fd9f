// The one place that says which role may do what (product.md, "Who uses it").
// Every route guards itself with requireRole(action); the client only hides controls.

export const ROLES = ['owner', 'engineer', 'drafter', 'manager'] as const;
export type Role = (typeof ROLES)[number];

export const ACTIONS = [
  'project:read',
  'project:write',
  'project:delete',
  'scheme:write',
  'plan:write',
  'marks:edit',
  'export:read',
  'scheme:status',
  'comment:write',
  'prices:edit',
  'team:manage',
  'outbox:read',
  'audit:read',
] as const;
export type Action = (typeof ACTIONS)[number];

const EVERY_ACTION: readonly Action[] = ACTIONS;

// Invitations, roles, the mail outbox (it holds sign-in links) and the audit log.
const OWNER_ONLY: ReadonlySet<Action> = new Set<Action>(['team:manage', 'outbox:read', 'audit:read']);

const GRANTS: Record<Role, ReadonlySet<Action>> = {
  // Owner: everything.
  owner: new Set(EVERY_ACTION),
  // Engineer: everything except team, roles, firm-wide prices, the outbox and the audit log.
  engineer: new Set(EVERY_ACTION.filter((a) => !OWNER_ONLY.has(a) && a !== 'prices:edit')),
  // Drafter: reads, exports, renumbers marks; no geometry, loads or sizes.
  drafter: new Set<Action>(['project:read', 'export:read', 'marks:edit']),
  // Manager: reads everything, sets scheme status, comments, edits unit prices.
  manager: new Set<Action>([
    'project:read',
    'export:read',
    'scheme:status',
    'comment:write',
    'prices:edit',
  ]),
};

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}

export function can(role: Role, action: Action): boolean {
  return GRANTS[role]?.has(action) ?? false;
}
