import { useState } from 'react';
import type { Project } from '../api/project.schema';
import { useUpdateProject } from '../api/update-project.api';
import { ProjectForm } from './project-form.component';

export function EditProjectForm({ project, readOnly }: { project: Project; readOnly: boolean }) {
  const updateProject = useUpdateProject(project.id);
  const [savedAt, setSavedAt] = useState<string | null>(null);
  return (
    <div className="flex flex-col gap-3">
      <ProjectForm
        key={project.id}
        project={project}
        readOnly={readOnly}
        label="Project details"
        submitLabel="Save details"
        onSubmit={async (values) => {
          await updateProject.mutateAsync(values);
          setSavedAt(new Date().toLocaleTimeString());
        }}
      />
      {savedAt ? (
        <p role="status" className="text-sm text-ink-soft">
          Saved at <span className="figures">{savedAt}</span>.
        </p>
      ) : null}
    </div>
  );
}
