// What each role may do, as the client shows it. The server enforces every rule; the client
// only hides what a role cannot do.

export const ROLES = ['owner', 'engineer', 'drafter', 'manager'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  owner: 'Owner',
  engineer: 'Engineer',
  drafter: 'Drafter',
  manager: 'Manager',
};

export const ROLE_SUMMARIES: Record<Role, { does: string; mayNot: string }> = {
  owner: {
    does: 'Everything an engineer does; invites people, sets roles and the firm’s unit prices.',
    mayNot: '—',
  },
  engineer: {
    does: 'Creates projects, schemes, levels and grids; draws framing, loads and deck; sets the design basis; locks sizes.',
    mayNot: 'Change roles.',
  },
  drafter: {
    does: 'Reads plans, marks and sizes; renumbers marks; exports schedules, plan sheets and CSV.',
    mayNot: 'Change geometry, loads or sizes.',
  },
  manager: {
    does: 'Reads everything; compares schemes; sets scheme status; comments; edits unit prices.',
    mayNot: 'Change geometry, loads or sizes.',
  },
};

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}

export function canEditProjects(role: Role): boolean {
  return role === 'owner' || role === 'engineer';
}

export function canManageTeam(role: Role): boolean {
  return role === 'owner';
}
