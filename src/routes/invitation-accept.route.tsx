import { useQueryClient } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { AppFooter } from '../app/app-footer.component';
import { BrandMark } from '../app/app-header.component';
import { AuthCard } from '../components/ui/auth-card.ui';
import { FormAlert } from '../components/ui/form-alert.ui';
import { Loading } from '../components/ui/loading.ui';
import { paths } from '../config/paths';
import { sessionQueryKey } from '../features/auth/api/get-session.api';
import { sessionSchema } from '../features/auth/api/session.schema';
import { useInvitationPreview } from '../features/invitations/api/get-invitation-preview.api';
import { AcceptInvitationForm } from '../features/invitations/components/accept-invitation-form.component';
import { ROLE_LABELS } from '../lib/permissions';

function Frame({ children }: { children: ReactNode }) {
  return (
    <div className="drafting-grid flex min-h-dvh flex-col">
      <div className="flex flex-1 flex-col items-center justify-center px-4 py-12">
        <div className="mb-8 flex items-center gap-2.5 text-ink">
          <BrandMark className="size-9" />
          <span className="text-2xl font-semibold tracking-tight">Baywright</span>
        </div>
        {children}
      </div>
      <AppFooter />
    </div>
  );
}

export default function InvitationAcceptRoute() {
  const { token = '' } = useParams();
  const preview = useInvitationPreview(token);
  const queryClient = useQueryClient();
  const navigate = useNavigate();

  const onAccepted = (accepted: unknown) => {
    // Whoever was signed in on this browser is not any more: start from a clean cache.
    queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== sessionQueryKey[0] });
    queryClient.setQueryData(sessionQueryKey, sessionSchema.parse(accepted));
    navigate(paths.projects.href(), { replace: true });
  };

  const footer = (
    <>
      Already have an account?{' '}
      <Link to={paths.signIn.href()} className="font-medium text-accent underline-offset-4 hover:underline">
        Sign in
      </Link>
    </>
  );

  if (preview.isPending) {
    return (
      <Frame>
        <Loading label="Opening the invitation…" />
      </Frame>
    );
  }
  if (preview.isError) {
    return (
      <Frame>
        <title>Invitation · Baywright</title>
        <AuthCard sheet="Invitation" title="This invitation cannot be used" footer={footer}>
          <FormAlert>{preview.error.message}</FormAlert>
        </AuthCard>
      </Frame>
    );
  }
  const inv = preview.data;
  return (
    <Frame>
      <title>Join {inv.firmName} · Baywright</title>
      <AuthCard
        sheet="Invitation"
        title={`Join ${inv.firmName}`}
        intro={`You are invited as ${ROLE_LABELS[inv.role].toLowerCase()}. Choose your name and a password to start.`}
        footer={footer}
      >
        <AcceptInvitationForm token={token} email={inv.email} onAccepted={onAccepted} />
      </AuthCard>
    </Frame>
  );
}
