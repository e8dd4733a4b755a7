import { createBrowserRouter, Navigate, type RouteObject } from 'react-router-dom';
import { LoadingState } from '../components/ui/loading-state.tsx';
import { MOVED_PAGES, paths, sharedPath } from '../config/paths.ts';
import { RequireRole } from './require-role.tsx';
import { RouteError } from './routes/route-error.tsx';

// Every page is its own chunk (React Router's `lazy`); the shell loads once, after sign-in.
export const routes: RouteObject[] = [
  {
    HydrateFallback: () => <LoadingState variant="page" label="Opening Tidefield…" />,
    ErrorBoundary: RouteError,
    children: [
      { path: paths.signIn.path, lazy: () => import('./routes/sign-in.tsx') },
      { path: paths.signUp.path, lazy: () => import('./routes/sign-up.tsx') },
      { path: paths.forgotPassword.path, lazy: () => import('./routes/forgot-password.tsx') },
      { path: paths.resetPassword.path, lazy: () => import('./routes/reset-password.tsx') },
      { path: paths.acceptInvitation.path, lazy: () => import('./routes/accept-invitation.tsx') },
      { path: sharedPath.path, lazy: () => import('./routes/shared.tsx') },
      { path: paths.confirmEmail.path, lazy: () => import('./routes/confirm-email.tsx') },
      { path: paths.confirmSignUp.path, lazy: () => import('./routes/confirm-sign-up.tsx') },
      {
        lazy: () => import('./routes/app-root.tsx'),
        children: [
          {
            // Errors of a page stay inside the shell, so navigation keeps working.
            ErrorBoundary: RouteError,
            children: [
              { index: true, lazy: () => import('./routes/overview.tsx') },
              { path: paths.settings.path, lazy: () => import('./routes/settings.tsx') },
              { path: paths.scenarios.path, lazy: () => import('./routes/scenarios.tsx') },
              { path: paths.scenarios.new.path, lazy: () => import('./routes/scenarios-new.tsx') },
              { path: paths.scenarios.detail.path, lazy: () => import('./routes/scenarios-detail.tsx') },
              { path: paths.occurrenceTables.path, lazy: () => import('./routes/occurrence-tables.tsx') },
              { path: paths.occurrenceTables.detail.path, lazy: () => import('./routes/occurrence-tables-detail.tsx') },
              { path: paths.sweeps.path, lazy: () => import('./routes/sweeps.tsx') },
              { path: paths.sweeps.detail.path, lazy: () => import('./routes/sweeps-detail.tsx') },
              { path: paths.fits.path, lazy: () => import('./routes/fits.tsx') },
              { path: paths.fits.detail.path, lazy: () => import('./routes/fits-detail.tsx') },
              { path: paths.impliedOccurrence.path, lazy: () => import('./routes/implied-occurrence.tsx') },
              { path: paths.samples.path, lazy: () => import('./routes/samples.tsx') },
              { path: paths.samples.new.path, lazy: () => import('./routes/samples-new.tsx') },
              { path: paths.samples.detail.path, lazy: () => import('./routes/samples-detail.tsx') },
              { path: paths.apiTokens.path, lazy: () => import('./routes/api-tokens.tsx') },
              { path: paths.runs.path, lazy: () => import('./routes/runs.tsx') },
              { path: paths.runs.new.path, lazy: () => import('./routes/runs-new.tsx') },
              { path: paths.runs.detail.path, lazy: () => import('./routes/runs-detail.tsx') },
              { path: paths.compare.path, lazy: () => import('./routes/compare.tsx') },
              { path: paths.constraintSets.path, lazy: () => import('./routes/constraint-sets.tsx') },
              { path: paths.twoSample.path, lazy: () => import('./routes/two-sample.tsx') },
              // E-mail notices now live in Settings; old links (and e-mails) still land there.
              ...MOVED_PAGES.map((moved) => ({ path: moved.from, element: <Navigate to={moved.to} replace /> })),
              {
                element: <RequireRole minimum="admin" />,
                children: [
                  { path: paths.members.path, lazy: () => import('./routes/members.tsx') },
                  { path: paths.credits.path, lazy: () => import('./routes/credits.tsx') },
                  { path: paths.outbox.path, lazy: () => import('./routes/outbox.tsx') },
                  { path: paths.workers.path, lazy: () => import('./routes/workers.tsx') },
                ],
              },
              { path: '*', lazy: () => import('./routes/not-found.tsx') },
            ],
          },
        ],
      },
    ],
  },
];

export const router = createBrowserRouter(routes);
