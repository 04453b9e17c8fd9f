import { useRef, useState } from 'react';
import { Button } from '../../../components/ui/button.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { useCreateScheme } from '../api/create-scheme.api';
import { PlanImportError, useImportScheme, type ImportedScheme } from '../api/import-scheme.api';

/** "New scheme" (empty plan, one level) and "Import plan file" (a .plan.json exported here or written by hand). */
export function NewScheme({ projectId }: { projectId: string }) {
  const create = useCreateScheme(projectId);
  const importer = useImportScheme(projectId);
  const [name, setName] = useState('');
  const [imported, setImported] = useState<ImportedScheme | null>(null);
  const fileInput = useRef<HTMLInputElement>(null);
  const importError = importer.error;

  return (
    <div className="flex flex-col gap-3 rounded-[3px] border border-ink/80 bg-paper-raised p-4">
      <form
        className="flex flex-wrap items-end gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          const trimmed = name.trim();
          if (!trimmed) return;
          create.mutate(trimmed, { onSuccess: () => setName('') });
        }}
      >
        <label className="flex flex-col gap-1 text-sm">
          <span className="label-caps">New scheme</span>
          <input
            value={name}
            maxLength={200}
            onChange={(e) => setName(e.target.value)}
            placeholder="e.g. Scheme C — 35 ft bays"
            className="h-9 min-w-64 rounded-[3px] border border-ink/60 bg-paper px-2"
          />
        </label>
        <Button type="submit" pending={create.isPending} disabled={!name.trim()}>
          New scheme
        </Button>
        <span className="mx-1 self-center text-sm text-ink-soft">or</span>
        <input
          ref={fileInput}
          type="file"
          accept=".json,application/json"
          className="sr-only"
          aria-label="Plan file to import"
          onChange={(e) => {
            const file = e.target.files?.[0];
            e.target.value = '';
            if (!file) return;
            setImported(null);
            importer.mutate({ file, name: name.trim() || undefined }, { onSuccess: setImported });
          }}
        />
        <Button variant="secondary" pending={importer.isPending} onClick={() => fileInput.current?.click()}>
          Import plan file
        </Button>
      </form>
      {create.isError ? <FormAlert>{create.error.message}</FormAlert> : null}
      {importError ? (
        <FormAlert>
          {importError.message}
          {importError instanceof PlanImportError && importError.problems.length > 0 ? (
            <ul className="mt-1 list-disc pl-5 font-mono text-xs">
              {importError.problems.map((p) => (
                <li key={p}>{p}</li>
              ))}
            </ul>
          ) : null}
        </FormAlert>
      ) : null}
      {imported ? (
        <FormAlert tone="notice">
          Imported “{imported.scheme.name}”.
          {imported.repairs.length > 0 ? ` Repaired on import: ${imported.repairs.join('; ')}.` : ''}
          {imported.problems.length > 0 ? ` To finish on the plan: ${imported.problems.join('; ')}.` : ''}
        </FormAlert>
      ) : null}
    </div>
  );
}
