import { Link, useLocation } from 'react-router-dom';
import { paths } from '../config/paths';
import type { Session } from '../features/auth/api/session.schema';
import { useSignOut } from '../features/auth/api/sign-out.api';
import { canEditProjects, canManageTeam, ROLE_LABELS } from '../lib/permissions';

type NavItem = { label: string; to: string; isActive: (pathname: string) => boolean };

const under = (base: string) => (pathname: string) => pathname === base || pathname.startsWith(`${base}/`);

/** The header's links for a role: the client hides what a role cannot do. */
export function navItemsFor(role: Session['role']): NavItem[] {
  const newProject = paths.newProject.href();
  const items: NavItem[] = [
    {
      label: 'Projects',
      to: paths.projects.href(),
      isActive: (pathname) => under(paths.projects.href())(pathname) && pathname !== newProject,
    },
  ];
  if (canEditProjects(role)) items.push({ label: 'New project', to: newProject, isActive: (p) => p === newProject });
  if (canManageTeam(role)) items.push({ label: 'Team', to: paths.team.href(), isActive: under(paths.team.href()) });
  items.push({ label: 'Settings', to: paths.settings.href(), isActive: (p) => p === paths.settings.href() });
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
  const { pathname } = useLocation();

  return (
    <header className="border-b-[3px] border-double border-ink bg-paper-raised">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 px-4 sm:px-6 md:h-14 md:flex-nowrap">
        <Link to={paths.projects.href()} className="flex h-14 items-center gap-2 text-ink" aria-label="Baywright, projects">
          <BrandMark className="size-6" />
          <span className="text-[1.05rem] font-semibold tracking-tight">Baywright</span>
        </Link>
        <span aria-hidden className="hidden h-6 w-px bg-line lg:block" />
        <span className="label-caps hidden max-w-64 truncate lg:inline" title={session.firm.name}>
          {session.firm.name}
        </span>
        <nav aria-label="Main" className="order-last -mx-2 flex h-11 w-[calc(100%+1rem)] items-stretch gap-1 overflow-x-auto border-t border-line md:order-none md:mx-0 md:h-full md:w-auto md:border-t-0">
          {navItemsFor(session.role).map((item) => (
            <Link
              key={item.to}
              to={item.to}
              aria-current={item.isActive(pathname) ? 'page' : undefined}
              className={`flex items-center border-b-2 px-2.5 text-sm whitespace-nowrap transition-colors ${
                item.isActive(pathname)
                  ? 'border-accent font-medium text-ink'
                  : 'border-transparent text-ink-soft hover:border-ink/30 hover:text-ink'
              }`}
            >
              {item.label}
            </Link>
          ))}
        </nav>
        <div className="ml-auto flex items-center gap-3">
          <div className="min-w-0 max-w-40 text-right leading-tight sm:max-w-none">
            <div className="truncate text-sm font-medium text-ink">
              <span className="sr-only">Signed in as </span>
              {session.user.name}
            </div>
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
            className="h-8 rounded-[3px] border border-ink/70 px-3 text-sm whitespace-nowrap text-ink hover:bg-paper-sunk disabled:opacity-60"
          >
            Sign out
          </button>
        </div>
      </div>
    </header>
  );
}
