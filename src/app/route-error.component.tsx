import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { EngineerCaution } from '../components/ui/engineer-caution.ui';
import { paths } from '../config/paths';

/** Last line of defence for a page that failed to load or render: nothing saved is lost. */
export function RouteError() {
  const error = useRouteError();
  const detail = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : error instanceof Error
      ? error.message
      : 'Unknown error';
  return (
    <div className="drafting-grid flex min-h-dvh flex-col items-center justify-center gap-4 px-6 text-center">
      <h1 className="text-xl font-semibold text-ink">This page could not be shown</h1>
      <p className="max-w-md text-sm text-ink-soft">
        Nothing you saved was lost. Reload the page, or go back to your projects.
      </p>
      <p className="font-mono text-xs text-ink-faint">{detail}</p>
      <div className="flex gap-3">
        <button type="button" className="text-sm text-accent underline" onClick={() => window.location.reload()}>
          Reload
        </button>
        <Link to={paths.projects.href()} className="text-sm text-accent underline">
          Projects
        </Link>
      </div>
      <EngineerCaution className="mt-8 max-w-xl" />
    </div>
  );
}
