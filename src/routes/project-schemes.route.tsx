import { useParams } from 'react-router-dom';
import { EmptyState } from '../components/ui/empty-state.ui';
import { EngineerCaution } from '../components/ui/engineer-caution.ui';
import { FormAlert } from '../components/ui/form-alert.ui';
import { Loading } from '../components/ui/loading.ui';
import { useCurrentSession } from '../features/auth/hooks/use-current-session.hook';
import { useSchemes } from '../features/schemes/api/get-schemes.api';
import { NewScheme } from '../features/schemes/components/new-scheme.component';
import { SchemesTable } from '../features/schemes/components/schemes-table.component';
import { canEditProjects } from '../lib/permissions';

/** A project's framing schemes: each one way to frame the building, with its latest design. */
export default function ProjectSchemesRoute() {
  const { projectId = '' } = useParams();
  const session = useCurrentSession();
  // Engineers and owners create and change schemes; the server enforces it for every call.
  const mayWrite = canEditProjects(session.role);
  const schemes = useSchemes(projectId);

  return (
    <section aria-labelledby="schemes-heading" className="flex flex-col gap-4">
      <h2 id="schemes-heading" className="sr-only">
        Schemes
      </h2>
      {mayWrite ? <NewScheme projectId={projectId} /> : null}
      {schemes.isPending ? (
        <Loading label="Loading schemes…" />
      ) : schemes.isError ? (
        <FormAlert>Schemes could not be loaded: {schemes.error.message}</FormAlert>
      ) : schemes.data.length === 0 ? (
        <EmptyState title="No schemes yet">
          {mayWrite
            ? 'A scheme is one way to frame this building: its levels, grid, members, deck and loads. Start one above, or import a plan file.'
            : 'Schemes appear here when an engineer of your firm starts one.'}
        </EmptyState>
      ) : (
        <>
          <SchemesTable schemes={schemes.data} mayWrite={mayWrite} />
          <EngineerCaution />
        </>
      )}
    </section>
  );
}
