import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { paths, safeNextPath } from '../config/paths';
import { SignInForm } from '../features/auth/components/sign-in-form.component';
import { AuthCard } from '../components/ui/auth-card.ui';

export default function SignInRoute() {
  const navigate = useNavigate();
  const [search] = useSearchParams();
  return (
    <AuthCard
      sheet="Sign in"
      title="Sign in to your firm"
      footer={
        <>
          New to Baywright?{' '}
          <Link to={paths.signUp.href()} className="font-medium text-accent underline-offset-4 hover:underline">
            Set up your firm
          </Link>
        </>
      }
    >
      <SignInForm onSignedIn={() => navigate(safeNextPath(search.get('next')), { replace: true })} />
      <p className="mt-4 text-center text-sm">
        <Link to={paths.passwordForgot.href()} className="text-ink-soft underline-offset-4 hover:text-accent hover:underline">
          Forgot your password?
        </Link>
      </p>
    </AuthCard>
  );
}
