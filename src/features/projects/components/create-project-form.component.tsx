import type { ReactNode } from 'react';
import { useCreateProject } from '../api/create-project.api';
import type { Project } from '../api/project.schema';
import { ProjectForm } from './project-form.component';

export function CreateProjectForm({ onCreated, cancel }: { onCreated: (project: Project) => void; cancel?: ReactNode }) {
  const createProject = useCreateProject();
  return (
    <ProjectForm
      label="New project"
      submitLabel="Create project"
      secondaryAction={cancel}
      onSubmit={async (values) => onCreated(await createProject.mutateAsync(values))}
    />
  );
}
