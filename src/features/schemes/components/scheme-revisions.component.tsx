import { Button } from '../../../components/ui/button.ui';
import { Loading } from '../../../components/ui/loading.ui';
import { useRevisions } from '../api/get-revisions.api';
import { useRestoreRevision } from '../api/restore-revision.api';
import type { SchemeSummary } from '../api/scheme.schema';

const timeFormat = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

/** Every saved revision with who and when; restoring makes a new revision equal to an old one. */
export function SchemeRevisions({ scheme, mayWrite }: { scheme: SchemeSummary; mayWrite: boolean }) {
  const revisions = useRevisions(scheme.id);
  const restore = useRestoreRevision(scheme.projectId, scheme.id);
  if (revisions.isPending) return <Loading label="Loading revisions…" />;
  if (revisions.isError) return <p className="text-xs text-danger">Revisions could not be loaded: {revisions.error.message}</p>;
  return (
    <div className="mt-2 max-w-lg">
      <ol className="flex flex-col divide-y divide-line rounded-[3px] border border-line bg-paper text-xs" aria-label={`Revisions of ${scheme.name}`}>
        {revisions.data.map((r) => (
          <li key={r.revision} className="flex items-center gap-3 px-2 py-1.5">
            <span className="figures w-10 font-mono">r{r.revision}</span>
            <span className="flex-1">
              {r.userName ?? 'Former member'} · {timeFormat.format(new Date(r.createdAt))}
              {r.summary ? <span className="block text-ink" data-testid="revision-summary">{r.summary}</span> : null}
              {r.note ? <span className="block text-ink-soft">{r.note}</span> : null}
            </span>
            {r.current ? (
              <span className="text-ink-soft">Current</span>
            ) : mayWrite ? (
              <Button
                variant="quiet"
                className="h-7 px-2 text-xs"
                pending={restore.isPending && restore.variables === r.revision}
                onClick={() => restore.mutate(r.revision)}
              >
                Restore
              </Button>
            ) : null}
          </li>
        ))}
      </ol>
      {restore.isError ? <p className="mt-1 text-xs text-danger">{restore.error.message}</p> : null}
      {restore.isSuccess ? (
        <p className="mt-1 text-xs text-ink-soft">
          Revision {restore.data.restoredFrom} restored as revision {restore.data.revision}; the revisions in between are kept.
        </p>
      ) : null}
    </div>
  );
}
