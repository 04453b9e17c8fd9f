import { useParams, useSearchParams } from 'react-router-dom';
import { FormAlert } from '../components/ui/form-alert.ui';
import { Loading } from '../components/ui/loading.ui';
import { useCurrentSession } from '../features/auth/hooks/use-current-session.hook';
import { ColumnStackScreen } from '../features/column-stack/components/column-stack-screen.component';
import { useSchemes } from '../features/schemes/api/get-schemes.api';
import { canEditProjects } from '../lib/permissions';

/** Column stack: the column schedule of a scheme, a column's sheet, and its splices (engineer and owner edit). */
export default function ProjectColumnsRoute() {
  const { projectId = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const session = useCurrentSession();
  const schemes = useSchemes(projectId);
  return (
    <section aria-labelledby="columns-heading" className="flex flex-col gap-4">
      <h2 id="columns-heading" className="sr-only">
        Column stack
      </h2>
      {schemes.isPending ? (
        <Loading label="Loading schemes…" />
      ) : schemes.isError ? (
        <FormAlert>Schemes could not be loaded: {schemes.error.message}</FormAlert>
      ) : (
        <ColumnStackScreen
          projectId={projectId}
          schemes={schemes.data.filter((s) => !s.archived).map((s) => ({ id: s.id, name: s.name, status: s.status }))}
          canEdit={canEditProjects(session.role)}
          initialSchemeId={search.get('scheme')}
          initialColumnId={search.get('column')}
          onOpen={({ schemeId, columnId }) => {
            const next = new URLSearchParams();
            next.set('scheme', schemeId);
            if (columnId) next.set('column', columnId);
            setSearch(next, { replace: true });
          }}
        />
      )}
    </section>
  );
}
