import { Link, useNavigate } from 'react-router-dom';
import { paths } from '../config/paths';
import { SignUpForm } from '../features/auth/components/sign-up-form.component';
import { AuthCard } from '../components/ui/auth-card.ui';

export default function SignUpRoute() {
  const navigate = useNavigate();
  return (
    <AuthCard
      sheet="New firm"
      title="Set up your firm"
      intro="You become the firm’s owner: you can invite engineers, drafters and managers afterwards."
      footer={
        <>
          Already have an account?{' '}
          <Link to={paths.signIn.href()} className="font-medium text-accent underline-offset-4 hover:underline">
            Sign in
          </Link>
        </>
      }
    >
      <SignUpForm onSignedUp={() => navigate(paths.projects.href(), { replace: true })} />
    </AuthCard>
  );
}
