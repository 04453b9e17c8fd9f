import { useState, type ReactNode } from 'react';
import { Link, useParams } from 'react-router-dom';
import { AppFooter } from '../app/app-footer.component';
import { BrandMark } from '../app/app-header.component';
import { AuthCard } from '../components/ui/auth-card.ui';
import { FormAlert } from '../components/ui/form-alert.ui';
import { Loading } from '../components/ui/loading.ui';
import { paths } from '../config/paths';
import { usePasswordResetCheck } from '../features/password-reset/api/check-reset.api';
import { NewPasswordForm } from '../features/password-reset/components/new-password-form.component';

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

const signInLink = (
  <Link to={paths.signIn.href()} className="font-medium text-accent underline-offset-4 hover:underline">
    Go to sign in
  </Link>
);

export default function PasswordResetRoute() {
  const { token = '' } = useParams();
  const check = usePasswordResetCheck(token);
  const [doneFor, setDoneFor] = useState<string | null>(null);

  let body: ReactNode;
  if (doneFor) {
    body = (
      <p role="status" className="text-sm text-ink">
        The new password for <strong className="font-medium">{doneFor}</strong> is set, and every earlier session has
        ended. Sign in with the new password.
      </p>
    );
  } else if (check.isPending) {
    body = <Loading label="Checking the link…" />;
  } else if (check.isError) {
    body = (
      <div className="flex flex-col gap-3">
        <FormAlert>{check.error.message}</FormAlert>
        <Link to={paths.passwordForgot.href()} className="text-sm font-medium text-accent underline-offset-4 hover:underline">
          Ask for a new link
        </Link>
      </div>
    );
  } else {
    body = <NewPasswordForm token={token} onDone={setDoneFor} />;
  }

  return (
    <Frame>
      <title>New password · Baywright</title>
      <AuthCard
        sheet="Password"
        title="Choose a new password"
        intro={check.data && !doneFor ? `For ${check.data.email}.` : undefined}
        footer={signInLink}
      >
        {body}
      </AuthCard>
    </Frame>
  );
}
