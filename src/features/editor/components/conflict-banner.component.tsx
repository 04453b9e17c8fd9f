import { useState } from 'react';
import { Button } from '../../../components/ui/button.ui';
import type { MergeChoice } from '../../../../shared/schemas/plan-merge';
import { describeDiff } from '../sync/plan-diff';
import type { AutosaveSnapshot, MergedNotice } from '../sync/plan-autosave';

type Conflict = NonNullable<AutosaveSnapshot['conflict']>;

/**
 * Shown when someone else saved this scheme first and changed elements I changed too: one row
 * per such element with "Keep mine" / "Take theirs", and both for all. Everything else of both
 * merges on its own. When the two cannot be merged at all (`items` empty), the two whole-plan
 * ways on.
 */
export function ConflictBanner({
  conflict,
  onResolve,
  onKeepMine,
  onTakeTheirs,
}: {
  conflict: Conflict;
  onResolve: (choices: ReadonlyMap<string, MergeChoice>) => void;
  onKeepMine: () => void;
  onTakeTheirs: () => void;
}) {
  const [choices, setChoices] = useState<Map<string, MergeChoice>>(() => new Map());
  const who = conflict.updatedBy ?? 'Someone else';
  const when = conflict.updatedAt ? new Date(conflict.updatedAt).toLocaleTimeString() : null;
  const perElement = conflict.items.length > 0;
  const answered = conflict.items.every((i) => choices.has(i.key));
  const choose = (key: string, choice: MergeChoice) => setChoices((prev) => new Map(prev).set(key, choice));
  const all = (choice: MergeChoice) => onResolve(new Map(conflict.items.map((i) => [i.key, choice])));
  return (
    <div role="alert" className="flex flex-wrap items-start gap-3 border-2 border-notice bg-notice-wash px-4 py-3 text-sm text-ink">
      <div className="min-w-0 flex-1">
        <p className="font-semibold">
          {who} saved this scheme{when ? ` at ${when}` : ''} (revision {conflict.revision}) while you were drawing.{' '}
          {perElement
            ? `You both changed ${conflict.items.length === 1 ? 'one element' : `${conflict.items.length} elements`}: choose whose version to keep. Everything else of yours and theirs is merged. Nothing is saved until you choose, and your drawing is kept here.`
            : 'Your changes are not saved yet, and are kept here.'}
        </p>
        {!perElement && conflict.mergeProblem ? <p className="mt-1">They cannot be merged as they stand: {conflict.mergeProblem}.</p> : null}
        {!perElement && conflict.theirsVsBase ? <p className="mt-1">Changed there: {describeDiff(conflict.theirsVsBase)}.</p> : null}
        {!perElement && conflict.mineVsTheirs ? <p>Yours differs from theirs by: {describeDiff(conflict.mineVsTheirs)}.</p> : null}
        {perElement ? (
          <ul className="mt-2 flex flex-col gap-1" aria-label="Elements you both changed">
            {conflict.items.map((item) => (
              <li key={item.key} className="flex flex-wrap items-center gap-x-3 gap-y-1">
                <span className="min-w-0 flex-1">
                  <span className="font-semibold">{item.label}</span>: yours {item.mine}; theirs {item.theirs}
                </span>
                <fieldset className="flex gap-3" aria-label={`Whose ${item.label}`}>
                  {(['mine', 'theirs'] as const).map((choice) => (
                    <label key={choice} className="flex items-center gap-1">
                      <input type="radio" name={`merge-${item.key}`} checked={choices.get(item.key) === choice} onChange={() => choose(item.key, choice)} />
                      {choice === 'mine' ? 'Keep mine' : 'Take theirs'}
                    </label>
                  ))}
                </fieldset>
              </li>
            ))}
          </ul>
        ) : null}
      </div>
      <div className="flex flex-wrap gap-2">
        {perElement ? (
          <>
            <Button variant="primary" disabled={!answered} onClick={() => onResolve(choices)}>
              Save my choices
            </Button>
            <Button variant="secondary" onClick={() => all('mine')}>
              Keep mine for all
            </Button>
            <Button variant="secondary" onClick={() => all('theirs')}>
              Take theirs for all
            </Button>
          </>
        ) : (
          <>
            <Button variant="primary" onClick={onKeepMine}>
              Keep mine (save over)
            </Button>
            <Button variant="secondary" onClick={onTakeTheirs} disabled={!conflict.plan}>
              Take theirs
            </Button>
          </>
        )}
      </div>
    </div>
  );
}

/** After a save was merged with someone else's: what came in from theirs. */
export function MergedBanner({ merged, onDismiss }: { merged: MergedNotice; onDismiss: () => void }) {
  const who = merged.by.length ? merged.by.join(' and ') : 'Someone else';
  const shown = merged.changes.slice(0, 6);
  return (
    <div role="status" data-testid="merged-notice" className="flex flex-wrap items-start gap-3 border-b-2 border-notice bg-notice-wash px-4 py-2 text-sm text-ink">
      <div className="min-w-0 flex-1">
        <p>
          Merged with {who}&rsquo;s save (revision {merged.revision}); your changes are kept and saved with theirs.
          {merged.changes.length === 0 ? ' Nothing of theirs differed from yours.' : ' Taken in from theirs:'}
        </p>
        {shown.length ? (
          <ul className="list-disc pl-5">
            {shown.map((line) => (
              <li key={line}>{line}</li>
            ))}
            {merged.changes.length > shown.length ? <li>and {merged.changes.length - shown.length} more</li> : null}
          </ul>
        ) : null}
      </div>
      <Button variant="quiet" className="h-8 text-xs" onClick={onDismiss}>
        Dismiss
      </Button>
    </div>
  );
}
