// Every route of the client and the link builder for it. Components link through here,
// never through hand-written strings.

export const paths = {
  home: { path: '/', href: () => '/' },
  signIn: {
    path: '/signin',
    href: (next?: string | null) =>
      next && next !== '/' ? `/signin?next=${encodeURIComponent(next)}` : '/signin',
  },
  signUp: { path: '/signup', href: () => '/signup' },
  projects: { path: '/projects', href: () => '/projects' },
  newProject: { path: '/projects/new', href: () => '/projects/new' },
  project: {
    path: '/projects/:projectId',
    href: (projectId: string | number) => `/projects/${encodeURIComponent(String(projectId))}`,
  },
  projectPlan: {
    path: '/projects/:projectId/plan',
    /** The Plan, optionally of one scheme and level, or its Building (3D) view: /projects/7/plan?scheme=12&level=L2&view=building. */
    href: (projectId: string | number, at: { scheme?: string | number | null; level?: string | null; view?: 'building' | null } = {}) => {
      const q = new URLSearchParams();
      if (at.scheme != null && at.scheme !== '') q.set('scheme', String(at.scheme));
      if (at.level) q.set('level', at.level);
      if (at.view) q.set('view', at.view);
      const query = q.toString();
      return `${paths.project.href(projectId)}/plan${query ? `?${query}` : ''}`;
    },
  },
  /** The plan page opened on one scheme. */
  projectSchemePlan: {
    path: '/projects/:projectId/plan',
    href: (projectId: string | number, schemeId: string) =>
      `${paths.projectPlan.href(projectId)}?scheme=${encodeURIComponent(schemeId)}`,
  },
  projectSchedule: {
    path: '/projects/:projectId/schedule',
    href: (projectId: string | number) => `${paths.project.href(projectId)}/schedule`,
  },
  projectColumns: {
    path: '/projects/:projectId/columns',
    /** The Column stack, optionally of one scheme with one column's sheet open: /projects/7/columns?scheme=12&column=C3. */
    href: (projectId: string | number, at: { scheme?: string | null; column?: string | null } = {}) => {
      const q = new URLSearchParams();
      if (at.scheme) q.set('scheme', at.scheme);
      if (at.column) q.set('column', at.column);
      const query = q.toString();
      return `${paths.project.href(projectId)}/columns${query ? `?${query}` : ''}`;
    },
  },
  projectTonnage: {
    path: '/projects/:projectId/tonnage',
    href: (projectId: string | number) => `${paths.project.href(projectId)}/tonnage`,
  },
  projectDetails: {
    path: '/projects/:projectId/details',
    href: (projectId: string | number) => `${paths.project.href(projectId)}/details`,
  },
  settings: { path: '/settings', href: () => '/settings' },
  team: { path: '/settings/team', href: () => '/settings/team' },
  unitPrices: { path: '/settings/unit-prices', href: () => '/settings/unit-prices' },
  outbox: { path: '/settings/team/outbox', href: () => '/settings/team/outbox' },
  audit: { path: '/settings/team/audit', href: () => '/settings/team/audit' },
  invitationAccept: {
    path: '/invitations/:token',
    href: (token: string) => `/invitations/${encodeURIComponent(token)}`,
  },
  passwordForgot: { path: '/password-forgot', href: () => '/password-forgot' },
  passwordReset: {
    path: '/password-reset/:token',
    href: (token: string) => `/password-reset/${encodeURIComponent(token)}`,
  },
} as const;

/** A `next` value is followed only when it is a path inside this app. */
export function safeNextPath(next: string | null | undefined): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) {
    return paths.projects.href();
  }
  if (next === paths.signIn.path || next === paths.signUp.path) return paths.projects.href();
  return next;
}
