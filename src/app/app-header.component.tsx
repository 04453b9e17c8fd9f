import { NavLink } from 'react-router-dom';
import { paths } from '../config/paths';
import type { Session } from '../features/auth/api/session.schema';
import { useSignOut } from '../features/auth/api/sign-out.api';
import { canEditProjects, canManageTeam, ROLE_LABELS } from '../lib/permissions';

type NavItem = { label: string; to: string; end?: boolean };

/** The header's links for a role: the client hides what a role cannot do. */
export function navItemsFor(role: Session['role']): NavItem[] {
  const items: NavItem[] = [{ label: 'Projects', to: paths.projects.href(), end: false }];
  if (canEditProjects(role)) items.push({ label: 'New project', to: paths.newProject.href(), end: true });
  if (canManageTeam(role)) items.push({ label: 'Team', to: paths.team.href(), end: true });
  items.push({ label: 'Settings', to: paths.settings.href(), end: true });
  return items;
}

export function BrandMark({ className = '' }: { className?: string }) {
  return (
    <svg aria-hidden viewBox="0 0 32 32" className={className}>
      <path d="M3 7h26M3 25h26" stroke="currentColor" strokeWidth="3" />
      <path d="M10 7v18M22 7v18" stroke="currentColor" strokeWidth="1.4" />
      <path d="M16 7v18" stroke="var(--color-accent)" strokeWidth="1.8" />
    </svg>
  );
}

export function AppHeader({ session }: { session: Session }) {
  const signOut = useSignOut();

  return (
    <header className="border-b-[3px] border-double border-ink bg-paper-raised">
      <div className="mx-auto flex h-14 max-w-6xl items-center gap-6 px-6">
        <NavLink to={paths.projects.href()} className="flex items-center gap-2 text-ink" aria-label="Baywright, projects">
          <BrandMark className="size-6" />
          <span className="text-[1.05rem] font-semibold tracking-tight">Baywright</span>
        </NavLink>
        <span aria-hidden className="h-6 w-px bg-line" />
        <span className="label-caps hidden max-w-64 truncate lg:inline" title={session.firm.name}>
          {session.firm.name}
        </span>
        <nav aria-label="Main" className="flex h-full items-stretch gap-1">
          {navItemsFor(session.role).map((item) => (
            <NavLink
              key={item.to}
              to={item.to}
              end={item.end}
              className={({ isActive }) =>
                `flex items-center border-b-2 px-2.5 text-sm transition-colors ${
                  isActive
                    ? 'border-accent font-medium text-ink'
                    : 'border-transparent text-ink-soft hover:border-ink/30 hover:text-ink'
                }`
              }
            >
              {item.label}
            </NavLink>
          ))}
        </nav>
        <div className="ml-auto flex items-center gap-3">
          <div className="hidden text-right leading-tight sm:block" aria-label="Signed in as">
            <div className="text-sm font-medium text-ink">{session.user.name}</div>
            <div className="label-caps text-[0.625rem]">{ROLE_LABELS[session.role]}</div>
          </div>
          {signOut.isError ? (
            <span role="alert" className="text-xs text-danger">
              Sign-out failed. Try again.
            </span>
          ) : null}
          <button
            type="button"
            onClick={() => signOut.mutate()}
            disabled={signOut.isPending}
            className="h-8 rounded-[3px] border border-ink/70 px-3 text-sm text-ink hover:bg-paper-sunk disabled:opacity-60"
          >
            Sign out
          </button>
        </div>
      </div>
    </header>
  );
}
