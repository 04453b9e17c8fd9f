import { useNavigate, useParams } from 'react-router-dom';
import { Loading } from '../components/ui/loading.ui';
import { paths } from '../config/paths';
import { useCurrentSession } from '../features/auth/hooks/use-current-session.hook';
import { useProject } from '../features/projects/api/get-project.api';
import { DeleteProject } from '../features/projects/components/delete-project.component';
import { EditProjectForm } from '../features/projects/components/edit-project-form.component';
import { canEditProjects } from '../lib/permissions';

export default function ProjectDetailsRoute() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  const session = useCurrentSession();
  const navigate = useNavigate();
  const mayEdit = canEditProjects(session.role);

  if (!project.data) return <Loading />;
  return (
    <div className="grid gap-8 lg:grid-cols-[minmax(0,40rem)_1fr]">
      <section aria-labelledby="details-heading" className="flex flex-col gap-4">
        <h2 id="details-heading" className="text-lg font-semibold">
          Project details
        </h2>
        {mayEdit ? null : <p className="text-sm text-ink-soft">Your role can read these details; engineers and owners edit them.</p>}
        <EditProjectForm project={project.data} readOnly={!mayEdit} />
      </section>
      {mayEdit ? (
        <div className="lg:pt-11">
          <DeleteProject project={project.data} onDeleted={() => navigate(paths.projects.href(), { replace: true })} />
        </div>
      ) : null}
    </div>
  );
}
