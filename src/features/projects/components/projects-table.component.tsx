import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths';
import type { Project } from '../api/project.schema';

const dateFormat = new Intl.DateTimeFormat(undefined, { year: 'numeric', month: 'short', day: '2-digit' });

function formatDate(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? '—' : dateFormat.format(date);
}

export function ProjectsTable({ projects }: { projects: Project[] }) {
  return (
    <div className="overflow-x-auto rounded-[3px] border border-ink/80 bg-paper-raised">
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">Projects of your firm</caption>
        <thead>
          <tr className="border-b border-ink/80 bg-paper-sunk/60">
            <th scope="col" className="label-caps w-32 px-4 py-2.5 font-normal">No.</th>
            <th scope="col" className="label-caps px-4 py-2.5 font-normal">Project</th>
            <th scope="col" className="label-caps px-4 py-2.5 font-normal">Client</th>
            <th scope="col" className="label-caps hidden px-4 py-2.5 font-normal lg:table-cell">Site</th>
            <th scope="col" className="label-caps w-36 px-4 py-2.5 text-right font-normal">Updated</th>
          </tr>
        </thead>
        <tbody>
          {projects.map((project) => (
            <tr key={project.id} className="group border-b border-line last:border-b-0 hover:bg-accent-wash/50">
              <td className="px-4 py-3 font-mono text-xs text-ink-soft">{project.number || '—'}</td>
              <td className="px-4 py-3">
                <Link
                  to={paths.project.href(project.id)}
                  className="font-medium text-ink underline-offset-4 group-hover:text-accent-strong hover:underline"
                >
                  {project.name}
                </Link>
              </td>
              <td className="px-4 py-3 text-ink-soft">{project.client || '—'}</td>
              <td className="hidden px-4 py-3 text-ink-soft lg:table-cell">{project.address || '—'}</td>
              <td className="px-4 py-3 text-right text-ink-soft">{formatDate(project.updatedAt)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
