import { Navigate, Outlet, useSearchParams } from 'react-router-dom';
import { Loading } from '../components/ui/loading.ui';
import { safeNextPath } from '../config/paths';
import { useSession } from '../features/auth/api/get-session.api';
import { AppFooter } from './app-footer.component';
import { BrandMark } from './app-header.component';

/** The frame for signing in and signing up. Someone already signed in goes straight on. */
export function PublicLayout() {
  const session = useSession();
  const [search] = useSearchParams();

  if (session.data) return <Navigate to={safeNextPath(search.get('next'))} replace />;

  return (
    <div className="drafting-grid flex min-h-dvh flex-col">
      <div className="flex flex-1 flex-col items-center justify-center px-4 py-12">
        <div className="mb-8 flex items-center gap-2.5 text-ink">
          <BrandMark className="size-9" />
          <span className="text-2xl font-semibold tracking-tight">Baywright</span>
        </div>
        {session.isPending ? <Loading /> : <Outlet />}
      </div>
      <AppFooter />
    </div>
  );
}
