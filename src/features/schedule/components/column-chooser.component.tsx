import { useId } from 'react';

export interface ChoosableColumn {
  id: string;
  label: string;
}

/**
 * Which optional columns the schedule shows (so it fits the window): a disclosure with one
 * checkbox per column. Mark and size always show.
 */
export function ColumnChooser({ columns, hidden, onChange }: { columns: ChoosableColumn[]; hidden: ReadonlySet<string>; onChange: (hidden: Set<string>) => void }) {
  const id = useId();
  return (
    <details className="relative text-sm">
      <summary className="flex h-9 cursor-pointer list-none items-center rounded-[3px] border border-ink/60 bg-paper px-3" aria-controls={id}>
        Columns ({columns.length - hidden.size} of {columns.length})
      </summary>
      <fieldset id={id} className="absolute right-0 z-20 mt-1 flex w-56 flex-col gap-1 rounded-[3px] border border-ink bg-paper-raised p-2 shadow">
        <legend className="sr-only">Columns shown</legend>
        {columns.map((c) => (
          <label key={c.id} className="flex items-center gap-2">
            <input
              type="checkbox"
              checked={!hidden.has(c.id)}
              onChange={(e) => {
                const next = new Set(hidden);
                if (e.target.checked) next.delete(c.id);
                else next.add(c.id);
                onChange(next);
              }}
            />
            {c.label}
          </label>
        ))}
      </fieldset>
    </details>
  );
}
