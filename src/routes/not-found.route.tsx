import { ButtonLink } from '../components/ui/button.ui';
import { paths } from '../config/paths';

export default function NotFoundRoute() {
  return (
    <div className="flex flex-col items-start gap-4 py-10">
      <title>Page not found · Baywright</title>
      <div className="label-caps">Error 404</div>
      <h1 className="text-2xl font-semibold tracking-tight">This page does not exist</h1>
      <p className="max-w-lg text-sm text-ink-soft">The address may be mistyped, or the page has moved.</p>
      <ButtonLink to={paths.projects.href()} variant="secondary">
        Go to projects
      </ButtonLink>
    </div>
  );
}
