import { Navigate, Outlet, useLocation } from 'react-router-dom';
import { Button } from '../components/ui/button.ui';
import { CautionInFooter } from '../components/ui/engineer-caution.ui';
import { Loading } from '../components/ui/loading.ui';
import { paths } from '../config/paths';
import { useSession } from '../features/auth/api/get-session.api';
import { AppFooter } from './app-footer.component';
import { AppHeader } from './app-header.component';

/** The signed-in frame: header with role-aware navigation, the page, the caution footer. */
export function AppShellLayout() {
  const session = useSession();
  const location = useLocation();

  if (session.isPending) return <FullPageMessage><Loading label="Opening Baywright…" /></FullPageMessage>;
  if (session.isError) {
    return (
      <FullPageMessage>
        <div role="alert" className="flex flex-col items-center gap-3 text-center">
          <p className="text-sm text-ink">Baywright could not reach its server.</p>
          <Button variant="secondary" onClick={() => session.refetch()}>
            Try again
          </Button>
        </div>
      </FullPageMessage>
    );
  }
  if (!session.data) {
    return <Navigate to={paths.signIn.href(location.pathname + location.search)} replace />;
  }

  // The footer carries the caution: a screen's own would repeat it (once per screen is enough).
  return (
    <CautionInFooter>
    <div className="flex min-h-dvh flex-col">
      <AppHeader session={session.data} />
      {/* A scheme open on the Plan keeps the page's top margin small: the editor fills the window. */}
      <main className={`mx-auto w-full max-w-6xl flex-1 px-4 sm:px-6 ${/\/projects\/[^/]+\/plan$/.test(location.pathname) && new URLSearchParams(location.search).has('scheme') ? 'py-2' : 'py-8'}`}>
        <Outlet />
      </main>
      <AppFooter />
    </div>
    </CautionInFooter>
  );
}

function FullPageMessage({ children }: { children: React.ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col">
      <div className="flex flex-1 items-center justify-center">{children}</div>
      <AppFooter />
    </div>
  );
}
