import { useState } from 'react';
import { createBrowserRouter, Navigate, RouterProvider, type RouteObject } from 'react-router-dom';
import { Loading } from '../components/ui/loading.ui';
import { paths } from '../config/paths';
import { AppShellLayout } from './app-shell.layout';
import { PublicLayout } from './public.layout';
import { RouteError } from './route-error.component';

type PageModule = { default: React.ComponentType };
const page = (load: () => Promise<PageModule>) => async () => ({ Component: (await load()).default });

/** Every page is its own lazily loaded module under src/routes/. */
export const appRoutes: RouteObject[] = [
  {
    path: paths.home.path,
    errorElement: <RouteError />,
    hydrateFallbackElement: <Loading />,
    children: [
      { index: true, element: <Navigate to={paths.projects.href()} replace /> },
      {
        element: <PublicLayout />,
        children: [
          { path: paths.signIn.path, lazy: page(() => import('../routes/signin.route')) },
          { path: paths.signUp.path, lazy: page(() => import('../routes/signup.route')) },
          { path: paths.passwordForgot.path, lazy: page(() => import('../routes/password-forgot.route')) },
        ],
      },
      // Links from e-mails: open whether or not someone is signed in on this browser.
      { path: paths.invitationAccept.path, lazy: page(() => import('../routes/invitation-accept.route')) },
      { path: paths.passwordReset.path, lazy: page(() => import('../routes/password-reset.route')) },
      {
        element: <AppShellLayout />,
        children: [
          { path: paths.projects.path, lazy: page(() => import('../routes/projects.route')) },
          { path: paths.newProject.path, lazy: page(() => import('../routes/project-new.route')) },
          {
            path: paths.project.path,
            lazy: page(() => import('../routes/project.route')),
            children: [
              { index: true, lazy: page(() => import('../routes/project-schemes.route')) },
              { path: 'plan', lazy: page(() => import('../routes/project-plan.route')) },
              { path: 'schedule', lazy: page(() => import('../routes/project-schedule.route')) },
              { path: 'columns', lazy: page(() => import('../routes/project-columns.route')) },
              { path: 'tonnage', lazy: page(() => import('../routes/project-tonnage.route')) },
              { path: 'details', lazy: page(() => import('../routes/project-details.route')) },
            ],
          },
          { path: paths.settings.path, lazy: page(() => import('../routes/settings.route')) },
          { path: paths.team.path, lazy: page(() => import('../routes/team.route')) },
          { path: paths.unitPrices.path, lazy: page(() => import('../routes/unit-prices.route')) },
          { path: paths.outbox.path, lazy: page(() => import('../routes/outbox.route')) },
          { path: paths.audit.path, lazy: page(() => import('../routes/audit.route')) },
          { path: '*', lazy: page(() => import('../routes/not-found.route')) },
        ],
      },
    ],
  },
];

export function AppRouter() {
  const [router] = useState(() => createBrowserRouter(appRoutes));
  return <RouterProvider router={router} />;
}
