/**
 * The firm's deck profile library beside a deck's slab build-up: each profile with its build-up
 * in brief; owners and engineers rename or delete the firm's own (built-in profiles are fixed);
 * drafters and managers read the list. Deleting a profile never changes a deck: decks keep
 * their own copy of the build-up. The server enforces every rule; its word on a name is shown
 * beside the name field.
 */
import { useId, useState } from 'react';
import type { DeckProfile } from '../../../../shared/schemas/deck-profile.schema';
import { isApiError } from '../../../lib/api-client';

export interface DeckProfileLibraryProps {
  profiles: readonly DeckProfile[];
  canEdit: boolean;
  onRename: (id: string, name: string) => Promise<unknown>;
  onDelete: (id: string) => Promise<unknown>;
}

const brief = (p: DeckProfile) =>
  `${p.slab.ribHeight_in} in ribs + ${p.slab.toppingThickness_in} in topping, ${p.slab.concreteWeight_pcf} pcf, f'c ${p.slab.fc_ksi} ksi`;

/** The server's message for the name field, else its message, else a plain one. */
function messageOf(err: unknown, field: string): string {
  if (isApiError(err)) return err.fields?.[field] ?? err.message;
  return err instanceof Error ? err.message : 'The library could not be changed';
}

export function DeckProfileLibrary({ profiles, canEdit, onRename, onDelete }: DeckProfileLibraryProps) {
  const [renaming, setRenaming] = useState<string | null>(null);
  const [draft, setDraft] = useState('');
  const [confirming, setConfirming] = useState<string | null>(null);
  const [error, setError] = useState<{ id: string; text: string } | null>(null);
  const [status, setStatus] = useState<string | null>(null);
  const ids = useId();

  return (
    <details className="text-xs" data-testid="deck-profile-library">
      <summary className="cursor-pointer text-ink-soft">Deck profile library ({profiles.length})</summary>
      {!canEdit ? <p className="mt-1 text-ink-soft">Read only: owners and engineers keep the firm’s library.</p> : null}
      <ul className="mt-1 space-y-1">
        {profiles.map((p) => {
          const nameErrorId = `${ids}-${p.id}-error`;
          return (
            <li key={p.id} className="rounded-[3px] border border-line px-2 py-1" aria-label={`Deck profile ${p.name}`}>
              {renaming === p.id ? (
                <form
                  className="flex flex-wrap items-center gap-1"
                  aria-label={`Rename ${p.name}`}
                  onSubmit={(e) => {
                    e.preventDefault();
                    const name = draft.trim();
                    if (!name) return setError({ id: p.id, text: 'Name the profile' });
                    onRename(p.id, name)
                      .then(() => {
                        setRenaming(null);
                        setError(null);
                        setStatus(`Renamed “${p.name}” to “${name}”.`);
                      })
                      .catch((err: unknown) => setError({ id: p.id, text: messageOf(err, 'name') }));
                  }}
                >
                  <label className="flex items-center gap-1">
                    New name
                    <input
                      className="h-7 w-48 rounded-[3px] border border-line bg-paper-raised px-2"
                      value={draft}
                      maxLength={120}
                      aria-invalid={error?.id === p.id}
                      aria-describedby={error?.id === p.id ? nameErrorId : undefined}
                      onChange={(e) => setDraft(e.target.value)}
                    />
                  </label>
                  <button type="submit" className="h-7 rounded-[3px] border border-ink px-2">Save name</button>
                  <button type="button" className="h-7 rounded-[3px] border border-line px-2" onClick={() => { setRenaming(null); setError(null); }}>Cancel</button>
                  {error?.id === p.id ? <span id={nameErrorId} className="text-danger" role="alert">{error.text}</span> : null}
                </form>
              ) : (
                <div className="flex flex-wrap items-center gap-2">
                  <span className="font-medium text-ink">{p.name}</span>
                  <span className="figures font-mono text-ink-soft">{brief(p)}</span>
                  {p.builtIn ? (
                    <span className="text-ink-soft">built in: cannot be renamed or deleted</span>
                  ) : canEdit ? (
                    <>
                      <button type="button" className="h-7 rounded-[3px] border border-line px-2" onClick={() => { setRenaming(p.id); setDraft(p.name); setConfirming(null); setError(null); }}>Rename</button>
                      <button type="button" className="h-7 rounded-[3px] border border-line px-2" onClick={() => { setConfirming(p.id); setRenaming(null); setError(null); }}>Delete</button>
                    </>
                  ) : null}
                </div>
              )}
              {confirming === p.id ? (
                <div className="mt-1 flex flex-wrap items-center gap-1" role="group" aria-label={`Delete ${p.name}?`}>
                  <span>Delete “{p.name}” from the firm’s deck profiles? Decks that use it keep their build-up.</span>
                  <button
                    type="button"
                    className="h-7 rounded-[3px] border border-ink px-2"
                    onClick={() =>
                      onDelete(p.id)
                        .then(() => { setConfirming(null); setStatus(`Deleted “${p.name}” from the library.`); })
                        .catch((err: unknown) => setError({ id: p.id, text: messageOf(err, 'id') }))
                    }
                  >
                    Delete “{p.name}”
                  </button>
                  <button type="button" className="h-7 rounded-[3px] border border-line px-2" onClick={() => setConfirming(null)}>Keep it</button>
                  {error?.id === p.id ? <span className="text-danger" role="alert">{error.text}</span> : null}
                </div>
              ) : null}
            </li>
          );
        })}
      </ul>
      {status ? <p className="mt-1 text-ink-soft" role="status">{status}</p> : null}
    </details>
  );
}
