import { useState } from 'react';
import { Button } from '../../../components/ui/button.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { Loading } from '../../../components/ui/loading.ui';
import { isApiError } from '../../../lib/api-client';
import { ROLE_LABELS } from '../../../lib/permissions';
import { useInvitations } from '../api/get-invitations.api';
import { useResendInvitation } from '../api/resend-invitation.api';
import { useRevokeInvitation } from '../api/revoke-invitation.api';

const dateFormat = new Intl.DateTimeFormat(undefined, { year: 'numeric', month: 'short', day: '2-digit', hour: '2-digit', minute: '2-digit' });

/** Invitations not yet accepted, with Resend (new link, old one dead) and Withdraw. */
export function PendingInvitations() {
  const invitations = useInvitations();
  const resend = useResendInvitation();
  const revoke = useRevokeInvitation();
  const [note, setNote] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const report = (error: unknown) => setProblem(isApiError(error) ? error.message : 'Something went wrong. Try again.');

  if (invitations.isPending) return <Loading label="Loading invitations…" />;
  if (invitations.isError) return <FormAlert>Invitations could not be loaded. {invitations.error.message}</FormAlert>;
  if (invitations.data.length === 0) {
    return <p className="text-sm text-ink-soft">No invitations are waiting.</p>;
  }
  return (
    <div className="flex flex-col gap-3">
      <FormAlert>{problem}</FormAlert>
      {note ? <p role="status" className="text-sm text-ink">{note}</p> : null}
      <ul aria-label="Waiting invitations" className="divide-y divide-line border border-ink/80 bg-paper-raised">
        {invitations.data.map((inv) => (
          <li key={inv.id} className="flex flex-wrap items-center gap-3 px-4 py-3 text-sm">
            <div className="min-w-0 flex-1">
              <div className="font-medium">{inv.email}</div>
              <div className="text-xs text-ink-soft">
                {ROLE_LABELS[inv.role]} · {inv.invitedBy ? `invited by ${inv.invitedBy} · ` : ''}
                {inv.expired ? (
                  <span className="font-medium text-danger">link expired</span>
                ) : (
                  <>link works until <span className="figures">{dateFormat.format(new Date(inv.expiresAt))}</span></>
                )}
              </div>
            </div>
            <Button
              variant="secondary"
              className="h-8 px-2.5"
              aria-label={`Resend the invitation to ${inv.email}`}
              disabled={resend.isPending || revoke.isPending}
              onClick={() => {
                setProblem(null);
                resend.mutate(inv.id, {
                  onSuccess: () => setNote(`A new link went to ${inv.email}; the previous one no longer works.`),
                  onError: report,
                });
              }}
            >
              Resend
            </Button>
            <Button
              variant="quiet"
              className="h-8 px-2.5"
              aria-label={`Withdraw the invitation to ${inv.email}`}
              disabled={resend.isPending || revoke.isPending}
              onClick={() => {
                setProblem(null);
                revoke.mutate(inv.id, {
                  onSuccess: () => setNote(`The invitation to ${inv.email} was withdrawn.`),
                  onError: report,
                });
              }}
            >
              Withdraw
            </Button>
          </li>
        ))}
      </ul>
    </div>
  );
}
