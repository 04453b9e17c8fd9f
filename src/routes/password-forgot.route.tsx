import { Link } from 'react-router-dom';
import { AuthCard } from '../components/ui/auth-card.ui';
import { paths } from '../config/paths';
import { ForgotPasswordForm } from '../features/password-reset/components/forgot-password-form.component';

export default function PasswordForgotRoute() {
  return (
    <AuthCard
      sheet="Password"
      title="Forgot your password?"
      intro="Give the e-mail address you sign in with; we send a link to choose a new password. It works for one hour."
      footer={
        <Link to={paths.signIn.href()} className="font-medium text-accent underline-offset-4 hover:underline">
          Back to sign in
        </Link>
      }
    >
      <title>Forgot password · Baywright</title>
      <ForgotPasswordForm />
    </AuthCard>
  );
}
