import { Link, NavLink, Outlet, useMatch, useParams, useSearchParams } from 'react-router-dom';
import { FormAlert } from '../components/ui/form-alert.ui';
import { Loading } from '../components/ui/loading.ui';
import { paths } from '../config/paths';
import { useProject } from '../features/projects/api/get-project.api';
import { isApiError } from '../lib/api-client';

const SECTIONS = [
  { label: 'Schemes', href: paths.project.href, end: true },
  { label: 'Plan', href: paths.projectPlan.href, end: true },
  { label: 'Schedule', href: paths.projectSchedule.href, end: true },
  { label: 'Column stack', href: (id: string | number) => paths.projectColumns.href(id), end: true },
  { label: 'Tonnage', href: paths.projectTonnage.href, end: true },
  { label: 'Project details', href: paths.projectDetails.href, end: true },
] as const;

/** A project's title block and its sections; each section is its own lazily loaded page. */
export default function ProjectRoute() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  // With a scheme open on the Plan the title block folds to one line, so the editor starts
  // high on the page and fills the window.
  const onPlan = useMatch(paths.projectPlan.path);
  const [search] = useSearchParams();
  const compact = !!onPlan && search.has('scheme');

  if (project.isPending) return <Loading label="Loading project…" />;
  if (project.isError) {
    const notFound = isApiError(project.error) && project.error.status === 404;
    return (
      <div className="flex flex-col gap-4">
        <title>Project not found · Baywright</title>
        <h1 className="text-2xl font-semibold">{notFound ? 'Project not found' : 'Project could not be loaded'}</h1>
        <FormAlert>
          {notFound ? 'It may have been deleted, or it belongs to another firm.' : project.error.message}
        </FormAlert>
        <Link to={paths.projects.href()} className="text-sm text-accent underline">
          Back to projects
        </Link>
      </div>
    );
  }

  const p = project.data;
  return (
    <div className={`flex flex-col ${compact ? 'gap-2' : 'gap-6'}`}>
      <title>{`${p.name} · Baywright`}</title>
      <header className="border-2 border-ink bg-paper-raised" data-compact={compact || undefined}>
        {compact ? (
          <div className="flex items-center gap-3 px-3 py-1.5">
            <Link to={paths.projects.href()} className="label-caps hover:text-ink hover:underline">
              Projects
            </Link>
            <span aria-hidden className="text-ink-faint">/</span>
            <h1 className="truncate text-base font-semibold text-ink">{p.name}</h1>
            {p.number ? <span className="figures font-mono text-xs text-ink-soft">{p.number}</span> : null}
          </div>
        ) : (
        <div className="flex flex-wrap items-stretch">
          <div className="min-w-0 flex-1 px-5 py-4">
            <div className="label-caps mb-1">
              <Link to={paths.projects.href()} className="hover:text-ink hover:underline">
                Projects
              </Link>{' '}
              /
            </div>
            <h1 className="truncate text-2xl font-semibold tracking-tight text-ink">{p.name}</h1>
            {p.description ? <p className="mt-1 line-clamp-2 max-w-2xl text-sm text-ink-soft">{p.description}</p> : null}
          </div>
          <dl className="grid w-full grid-cols-[auto_1fr] content-center gap-x-4 gap-y-1 border-t border-ink px-5 py-3 text-sm sm:w-auto sm:border-t-0 sm:border-l">
            <dt className="label-caps self-center">No.</dt>
            <dd className="figures font-mono text-ink">{p.number || '—'}</dd>
            <dt className="label-caps self-center">Client</dt>
            <dd className="text-ink">{p.client || '—'}</dd>
            <dt className="label-caps self-center">Site</dt>
            <dd className="max-w-64 truncate text-ink">{p.address || '—'}</dd>
          </dl>
        </div>
        )}
        <nav aria-label="Project sections" className="flex gap-1 overflow-x-auto border-t border-ink bg-paper px-3">
          {SECTIONS.map((section) => (
            <NavLink
              key={section.label}
              to={section.href(p.id)}
              end={section.end}
              className={({ isActive }) =>
                `-mb-px border-b-2 px-3 py-2.5 text-sm whitespace-nowrap ${
                  isActive ? 'border-accent font-medium text-ink' : 'border-transparent text-ink-soft hover:text-ink'
                }`
              }
            >
              {section.label}
            </NavLink>
          ))}
        </nav>
      </header>
      <Outlet />
    </div>
  );
}
