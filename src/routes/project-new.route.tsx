import { useNavigate } from 'react-router-dom';
import { ButtonLink } from '../components/ui/button.ui';
import { FormAlert } from '../components/ui/form-alert.ui';
import { PageHeader } from '../components/ui/page-header.ui';
import { paths } from '../config/paths';
import { useCurrentSession } from '../features/auth/hooks/use-current-session.hook';
import { CreateProjectForm } from '../features/projects/components/create-project-form.component';
import { canEditProjects, ROLE_LABELS } from '../lib/permissions';

export default function ProjectNewRoute() {
  const session = useCurrentSession();
  const navigate = useNavigate();

  return (
    <div className="flex max-w-2xl flex-col gap-6">
      <title>New project · Baywright</title>
      <PageHeader eyebrow="Projects" title="New project" description="Name the building; everything else can be filled in later." />
      {canEditProjects(session.role) ? (
        <CreateProjectForm
          onCreated={(project) => navigate(paths.project.href(project.id))}
          cancel={
            <ButtonLink variant="quiet" to={paths.projects.href()}>
              Cancel
            </ButtonLink>
          }
        />
      ) : (
        <FormAlert tone="notice">
          A {ROLE_LABELS[session.role].toLowerCase()} cannot start projects. Ask an engineer or the firm’s owner.
        </FormAlert>
      )}
    </div>
  );
}
