import { Button } from '../../../components/ui/button.ui';
import { describeDiff } from '../sync/plan-diff';
import type { AutosaveSnapshot } from '../sync/plan-autosave';

/** Shown when someone else saved this scheme first: what changed there, what differs here, and the two ways on. */
export function ConflictBanner({ conflict, onKeepMine, onTakeTheirs }: { conflict: NonNullable<AutosaveSnapshot['conflict']>; onKeepMine: () => void; onTakeTheirs: () => void }) {
  const who = conflict.updatedBy ?? 'Someone else';
  const when = conflict.updatedAt ? new Date(conflict.updatedAt).toLocaleTimeString() : null;
  return (
    <div role="alert" className="flex flex-wrap items-start gap-3 border-2 border-notice bg-notice-wash px-4 py-3 text-sm text-ink">
      <div className="min-w-0 flex-1">
        <p className="font-semibold">
          {who} saved this scheme{when ? ` at ${when}` : ''} (revision {conflict.revision}) while you were drawing. Your changes are not saved yet, and are kept here.
        </p>
        {conflict.theirsVsBase ? <p className="mt-1">Changed there: {describeDiff(conflict.theirsVsBase)}.</p> : null}
        {conflict.mineVsTheirs ? <p>Yours differs from theirs by: {describeDiff(conflict.mineVsTheirs)}.</p> : null}
      </div>
      <div className="flex gap-2">
        <Button variant="primary" onClick={onKeepMine}>
          Keep mine (save over)
        </Button>
        <Button variant="secondary" onClick={onTakeTheirs} disabled={!conflict.plan}>
          Take theirs
        </Button>
      </div>
    </div>
  );
}
