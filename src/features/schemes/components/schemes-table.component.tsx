import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button, buttonClasses } from '../../../components/ui/button.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { paths } from '../../../config/paths';
import { useCloneScheme } from '../api/clone-scheme.api';
import { useDeleteScheme } from '../api/delete-scheme.api';
import { schemeExportUrl } from '../api/export-scheme.api';
import { SCHEME_STATUS_LABELS, type SchemeSummary } from '../api/scheme.schema';
import { useUpdateScheme } from '../api/update-scheme.api';
import { SchemeRevisions } from './scheme-revisions.component';

const dateFormat = new Intl.DateTimeFormat(undefined, { year: 'numeric', month: 'short', day: '2-digit' });
const weightFormat = new Intl.NumberFormat(undefined, { minimumFractionDigits: 1, maximumFractionDigits: 1 });

function formatDate(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? '—' : dateFormat.format(date);
}

/** Steel weight in US tons (2,000 lb), the unit tonnage is priced in; spelled out, since "t" is the tonne (NIST SP 811). */
function tons(lb: number): string {
  return `${weightFormat.format(lb / 2000)} tons`;
}

function DesignCell({ scheme }: { scheme: SchemeSummary }) {
  const d = scheme.design;
  if (!d) return <span className="text-ink-soft">Not designed</span>;
  return (
    <span className="flex flex-wrap items-center gap-x-2 gap-y-1">
      <span className="figures font-mono">{tons(d.steelWeight_lb)}</span>
      <span className="figures font-mono text-ink-soft">{d.steel_psf.toFixed(2)} psf</span>
      <span className="figures font-mono text-ink-soft">{d.pieces} pcs</span>
      {d.stale ? (
        <span
          className="rounded-[3px] border border-ink/50 bg-paper-sunk px-1.5 text-xs text-ink"
          title={`Designed at revision ${d.revision}; the plan is now at revision ${scheme.revision}. Open the plan to design it again.`}
        >
          Stale · rev {d.revision}
        </span>
      ) : null}
      {d.failingMembers > 0 ? (
        <span className="rounded-[3px] border border-danger/70 px-1.5 text-xs text-danger">{d.failingMembers} failing</span>
      ) : null}
    </span>
  );
}

const NAME_REQUIRED = 'A scheme needs a name: type one, or Cancel to keep the old one.';

function RenameForm({ scheme, onDone }: { scheme: SchemeSummary; onDone: () => void }) {
  const update = useUpdateScheme(scheme.projectId);
  const [name, setName] = useState(scheme.name);
  const [blank, setBlank] = useState(false);
  return (
    <form
      className="flex flex-wrap items-center gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        const trimmed = name.trim();
        // A blank name is refused out loud, never dropped silently.
        setBlank(!trimmed);
        if (!trimmed) return;
        if (trimmed === scheme.name) return onDone();
        update.mutate({ schemeId: scheme.id, patch: { name: trimmed } }, { onSuccess: onDone });
      }}
    >
      <label className="sr-only" htmlFor={`rename-${scheme.id}`}>
        Scheme name
      </label>
      <input
        id={`rename-${scheme.id}`}
        value={name}
        maxLength={200}
        onChange={(e) => setName(e.target.value)}
        aria-invalid={blank || undefined}
        aria-describedby={blank ? `rename-${scheme.id}-e` : undefined}
        className="h-8 min-w-48 rounded-[3px] border border-ink/60 bg-paper px-2 text-sm"
        autoFocus
      />
      {blank ? <span id={`rename-${scheme.id}-e`} role="alert" className="text-xs text-danger">{NAME_REQUIRED}</span> : null}
      <Button type="submit" variant="secondary" pending={update.isPending} className="h-8">
        Save name
      </Button>
      <Button variant="quiet" className="h-8" onClick={onDone}>
        Cancel
      </Button>
      {update.isError ? <span className="text-xs text-danger">{update.error.message}</span> : null}
    </form>
  );
}

/** Clone asks for the new scheme's name, "<name> copy" unless changed. */
function CloneForm({ scheme, onDone }: { scheme: SchemeSummary; onDone: () => void }) {
  const clone = useCloneScheme(scheme.projectId);
  const [name, setName] = useState(`${scheme.name} copy`.slice(0, 200));
  const [blank, setBlank] = useState(false);
  const id = `clone-${scheme.id}`;
  return (
    <form
      className="flex flex-wrap items-center justify-end gap-2"
      aria-label={`Clone ${scheme.name}`}
      onSubmit={(e) => {
        e.preventDefault();
        const trimmed = name.trim();
        setBlank(!trimmed);
        if (!trimmed) return;
        clone.mutate({ schemeId: scheme.id, name: trimmed }, { onSuccess: onDone });
      }}
    >
      <label className="text-xs text-ink-soft" htmlFor={id}>
        Name of the copy
      </label>
      <input
        id={id}
        value={name}
        maxLength={200}
        onChange={(e) => setName(e.target.value)}
        aria-invalid={blank || undefined}
        className="h-8 min-w-48 rounded-[3px] border border-ink/60 bg-paper px-2 text-sm"
        autoFocus
      />
      <Button type="submit" variant="secondary" pending={clone.isPending} className="h-8">
        Make the copy
      </Button>
      <Button variant="quiet" className="h-8" onClick={onDone}>
        Cancel
      </Button>
      {blank ? <span role="alert" className="text-xs text-danger">{NAME_REQUIRED}</span> : null}
      {clone.isError ? <span className="text-xs text-danger">{clone.error.message}</span> : null}
    </form>
  );
}

function SchemeActions({ scheme, mayWrite }: { scheme: SchemeSummary; mayWrite: boolean }) {
  const [cloning, setCloning] = useState(false);
  const update = useUpdateScheme(scheme.projectId);
  const remove = useDeleteScheme(scheme.projectId);
  const error = update.error ?? remove.error;
  return (
    <div className="flex flex-col items-end gap-1">
      <div className="flex flex-wrap justify-end gap-1">
        <Link to={paths.projectSchemePlan.href(scheme.projectId, scheme.id)} className={buttonClasses('secondary', 'h-8')}>
          Open plan
        </Link>
        <Link to={paths.projectPlan.href(scheme.projectId, { scheme: scheme.id, view: 'building' })} className={buttonClasses('quiet', 'h-8')}>
          Building (3D)
        </Link>
        <a href={schemeExportUrl(scheme.id)} download className={buttonClasses('quiet', 'h-8')}>
          Export
        </a>
        {mayWrite ? (
          <>
            <Button variant="quiet" className="h-8" aria-expanded={cloning} onClick={() => setCloning((c) => !c)}>
              Clone
            </Button>
            <Button
              variant="quiet"
              className="h-8"
              pending={update.isPending}
              onClick={() => update.mutate({ schemeId: scheme.id, patch: { archived: !scheme.archived } })}
            >
              {scheme.archived ? 'Unarchive' : 'Archive'}
            </Button>
            <Button
              variant="quiet"
              className="h-8 text-danger"
              pending={remove.isPending}
              onClick={() => {
                if (window.confirm(`Delete "${scheme.name}" with its plan, revisions and design? This cannot be undone.`)) {
                  remove.mutate(scheme.id);
                }
              }}
            >
              Delete
            </Button>
          </>
        ) : null}
      </div>
      {cloning ? <CloneForm scheme={scheme} onDone={() => setCloning(false)} /> : null}
      {error ? <span className="text-xs text-danger">{error.message}</span> : null}
    </div>
  );
}

export function SchemesTable({ schemes, mayWrite }: { schemes: SchemeSummary[]; mayWrite: boolean }) {
  const [renaming, setRenaming] = useState<string | null>(null);
  const [history, setHistory] = useState<string | null>(null);
  return (
    <div className="overflow-x-auto rounded-[3px] border border-ink/80 bg-paper-raised">
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">Framing schemes of this project</caption>
        <thead>
          <tr className="border-b border-ink/80 bg-paper-sunk/60">
            <th scope="col" className="label-caps px-4 py-2.5 font-normal">Scheme</th>
            <th scope="col" className="label-caps px-4 py-2.5 font-normal">Status</th>
            <th scope="col" className="label-caps px-4 py-2.5 text-right font-normal">Rev.</th>
            <th scope="col" className="label-caps px-4 py-2.5 font-normal">Steel (latest design)</th>
            <th scope="col" className="label-caps hidden px-4 py-2.5 font-normal lg:table-cell">Updated</th>
            <th scope="col" className="px-4 py-2.5">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {schemes.map((scheme) => (
            <tr key={scheme.id} className={`border-b border-line align-top last:border-b-0 ${scheme.archived ? 'opacity-70' : ''}`}>
              <td className="px-4 py-3">
                {renaming === scheme.id ? (
                  <RenameForm scheme={scheme} onDone={() => setRenaming(null)} />
                ) : (
                  <div className="flex flex-col gap-0.5">
                    <Link
                      to={paths.projectSchemePlan.href(scheme.projectId, scheme.id)}
                      className="font-medium text-ink underline-offset-4 hover:text-accent-strong hover:underline"
                    >
                      {scheme.name}
                    </Link>
                    <span className="flex gap-2 text-xs text-ink-soft">
                      {scheme.archived ? <span>Archived</span> : null}
                      {mayWrite ? (
                        <button type="button" className="underline-offset-2 hover:underline" onClick={() => setRenaming(scheme.id)}>
                          Rename
                        </button>
                      ) : null}
                      <button
                        type="button"
                        className="underline-offset-2 hover:underline"
                        aria-expanded={history === scheme.id}
                        onClick={() => setHistory(history === scheme.id ? null : scheme.id)}
                      >
                        Revisions
                      </button>
                    </span>
                    {history === scheme.id ? <SchemeRevisions scheme={scheme} mayWrite={mayWrite} /> : null}
                  </div>
                )}
              </td>
              <td className="px-4 py-3">{SCHEME_STATUS_LABELS[scheme.status]}</td>
              <td className="figures px-4 py-3 text-right font-mono">{scheme.revision}</td>
              <td className="px-4 py-3">
                <DesignCell scheme={scheme} />
              </td>
              <td className="hidden px-4 py-3 text-ink-soft lg:table-cell">
                {formatDate(scheme.updatedAt)}
                {scheme.updatedBy ? <span className="block text-xs">{scheme.updatedBy.name}</span> : null}
              </td>
              <td className="px-4 py-3">
                <SchemeActions scheme={scheme} mayWrite={mayWrite} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {schemes.some((s) => s.design) ? null : (
        <div className="border-t border-line px-4 py-2">
          <FormAlert tone="notice">No scheme has been designed yet: open a plan to size its members.</FormAlert>
        </div>
      )}
    </div>
  );
}
