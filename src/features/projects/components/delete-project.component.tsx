import { useState } from 'react';
import { Button } from '../../../components/ui/button.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { isApiError } from '../../../lib/api-client';
import { useDeleteProject } from '../api/delete-project.api';
import type { Project } from '../api/project.schema';

/** Deleting asks once more, naming the project, before anything is lost. */
export function DeleteProject({ project, onDeleted }: { project: Project; onDeleted: () => void }) {
  const deleteProject = useDeleteProject(project.id);
  const [confirming, setConfirming] = useState(false);

  return (
    <section aria-labelledby="delete-project-heading" className="rounded-[3px] border border-danger/40 p-4">
      <h2 id="delete-project-heading" className="text-sm font-semibold text-ink">
        Delete project
      </h2>
      <p className="mt-1 text-sm text-ink-soft">Deleting removes the project and everything in it for the whole firm.</p>
      {deleteProject.error ? (
        <div className="mt-3">
          <FormAlert>{isApiError(deleteProject.error) ? deleteProject.error.message : 'Could not delete the project.'}</FormAlert>
        </div>
      ) : null}
      <div className="mt-3 flex flex-wrap items-center gap-2">
        {confirming ? (
          <>
            <Button
              variant="danger"
              pending={deleteProject.isPending}
              onClick={() => deleteProject.mutate(undefined, { onSuccess: onDeleted })}
            >
              Delete “{project.name}” permanently
            </Button>
            <Button variant="quiet" onClick={() => setConfirming(false)}>
              Keep it
            </Button>
          </>
        ) : (
          <Button variant="secondary" onClick={() => setConfirming(true)}>
            Delete project…
          </Button>
        )}
      </div>
    </section>
  );
}
