import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { LoadingState } from '../components/ui/loading-state.tsx';
import { paths, type PathKey } from '../config/paths.ts';
import { RequireRole } from './require-role.tsx';
import type { ComingSoonHandle } from './routes/coming-soon.tsx';
import { RouteError } from './routes/route-error.tsx';

/** A page that does not exist yet: its route already works and says what it will hold. */
function comingSoon(key: PathKey): RouteObject {
  const handle: ComingSoonHandle = { navKey: key };
  return { path: paths[key].path, handle, lazy: () => import('./routes/coming-soon.tsx') };
}

// Every page is its own chunk (React Router's `lazy`); the shell loads once, after sign-in.
export const routes: RouteObject[] = [
  {
    HydrateFallback: () => <LoadingState variant="page" label="Opening Tidefield…" />,
    ErrorBoundary: RouteError,
    children: [
      { path: paths.signIn.path, lazy: () => import('./routes/sign-in.tsx') },
      { path: paths.signUp.path, lazy: () => import('./routes/sign-up.tsx') },
      {
        lazy: () => import('./routes/app-root.tsx'),
        children: [
          {
            // Errors of a page stay inside the shell, so navigation keeps working.
            ErrorBoundary: RouteError,
            children: [
              { index: true, lazy: () => import('./routes/overview.tsx') },
              ...(
                ['scenarios', 'runs', 'sweeps', 'impliedOccurrence', 'compare', 'samples', 'occurrenceTables', 'apiTokens', 'settings'] as const
              ).map(comingSoon),
              {
                element: <RequireRole minimum="admin" />,
                children: [{ path: paths.members.path, lazy: () => import('./routes/members.tsx') }, comingSoon('credits')],
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
