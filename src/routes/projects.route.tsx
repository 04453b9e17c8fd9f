import { ButtonLink } from '../components/ui/button.ui';
import { EmptyState } from '../components/ui/empty-state.ui';
import { FormAlert } from '../components/ui/form-alert.ui';
import { Loading } from '../components/ui/loading.ui';
import { PageHeader } from '../components/ui/page-header.ui';
import { paths } from '../config/paths';
import { useCurrentSession } from '../features/auth/hooks/use-current-session.hook';
import { useProjects } from '../features/projects/api/get-projects.api';
import { ProjectsTable } from '../features/projects/components/projects-table.component';
import { canEditProjects } from '../lib/permissions';

export default function ProjectsRoute() {
  const session = useCurrentSession();
  const projects = useProjects();
  const mayCreate = canEditProjects(session.role);
  const count = projects.data?.length;

  return (
    <div className="flex flex-col gap-6">
      <title>Projects · Baywright</title>
      <PageHeader
        eyebrow={session.firm.name}
        title="Projects"
        description={
          count === undefined ? undefined : (
            <span className="figures">
              {count} {count === 1 ? 'project' : 'projects'}
            </span>
          )
        }
        actions={mayCreate ? <ButtonLink to={paths.newProject.href()}>Start a project</ButtonLink> : null}
      />
      {projects.isPending ? (
        <Loading label="Loading projects…" />
      ) : projects.isError ? (
        <FormAlert>Projects could not be loaded: {projects.error.message}</FormAlert>
      ) : projects.data.length === 0 ? (
        <EmptyState
          title="No projects yet"
          action={mayCreate ? <ButtonLink to={paths.newProject.href()}>Start a project</ButtonLink> : null}
        >
          {mayCreate
            ? 'A project holds one building: its design basis, levels, grids and the framing schemes you compare.'
            : 'Projects appear here when an engineer of your firm starts one.'}
        </EmptyState>
      ) : (
        <ProjectsTable projects={projects.data} />
      )}
    </div>
  );
}
