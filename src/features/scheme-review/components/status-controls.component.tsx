import { Button } from '../../../components/ui/button.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { useSetSchemeStatus } from '../api/set-status.api';
import type { SchemeStatus } from '../api/review.schema';

const ACTIONS: Record<SchemeStatus, { to: SchemeStatus; label: string; variant: 'primary' | 'secondary' | 'quiet' }[]> = {
  draft: [{ to: 'in_review', label: 'Submit for review', variant: 'secondary' }],
  in_review: [
    { to: 'chosen', label: 'Choose this scheme', variant: 'primary' },
    { to: 'draft', label: 'Back to draft', variant: 'quiet' },
  ],
  chosen: [
    { to: 'in_review', label: 'Reopen review', variant: 'secondary' },
    { to: 'draft', label: 'Back to draft', variant: 'quiet' },
  ],
};

/** Moves a scheme through review: submit, choose, reopen. Shown to roles that may. */
export function StatusControls({
  schemeId,
  schemeName,
  status,
  archived,
  onChanged,
}: {
  schemeId: string;
  schemeName: string;
  status: SchemeStatus;
  archived: boolean;
  onChanged?: () => unknown;
}) {
  const mutation = useSetSchemeStatus(schemeId, onChanged);
  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap gap-2">
        {ACTIONS[status].map((a) => (
          <Button
            key={a.to}
            variant={a.variant}
            className="h-8 px-2.5 text-xs"
            pending={mutation.isPending && mutation.variables === a.to}
            disabled={mutation.isPending || (a.to === 'chosen' && archived)}
            title={a.to === 'chosen' && archived ? 'Archived schemes cannot be chosen' : undefined}
            aria-label={`${a.label}: ${schemeName}`}
            onClick={() => mutation.mutate(a.to)}
          >
            {a.label}
          </Button>
        ))}
      </div>
      {mutation.isError ? <FormAlert>{mutation.error.message}</FormAlert> : null}
      {mutation.isSuccess && mutation.data.unchosen.length > 0 ? (
        <p role="status" className="text-xs text-ink-soft">
          {mutation.data.unchosen.map((u) => `"${u.name}"`).join(', ')} went back to in review: one scheme per project is chosen.
        </p>
      ) : null}
    </div>
  );
}
