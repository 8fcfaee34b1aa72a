import type { QueryClient } from '@tanstack/react-query';
import type { ComponentType } from 'react';
import { createBrowserRouter, type LoaderFunction, type RouteObject } from 'react-router-dom';
import { RouteError } from '../components/errors/route-error';
import { Spinner } from '../components/ui/spinner';
import { paths } from '../config/paths';
import { createJobsRoutes } from './job-routes';

/** What every file in app/routes/ exports. */
export interface RouteModule {
  default: ComponentType;
  clientLoader?: (queryClient: QueryClient) => LoaderFunction;
  ErrorBoundary?: ComponentType;
}

function lazyRoute(queryClient: QueryClient, load: () => Promise<RouteModule>): RouteObject['lazy'] {
  return async () => {
    const m = await load();
    return {
      Component: m.default,
      ...(m.clientLoader ? { loader: m.clientLoader(queryClient) } : {}),
      // Every route gets an error boundary; a module may bring a more specific one.
      ErrorBoundary: m.ErrorBoundary ?? RouteError,
    };
  };
}

export function createRoutes(queryClient: QueryClient): RouteObject[] {
  const lazy = (load: () => Promise<RouteModule>) => lazyRoute(queryClient, load);
  return [
    {
      // Catches what the lazy routes cannot, such as a chunk that failed to download.
      errorElement: <RouteError />,
      HydrateFallback: () => <Spinner label="Opening Gaugeline…" />,
      children: [
        { path: paths.signIn, lazy: lazy(() => import('./routes/sign-in')) },
        { path: paths.forgotPassword, lazy: lazy(() => import('./routes/forgot-password')) },
        { path: paths.resetPassword, lazy: lazy(() => import('./routes/reset-password')) },
        // The customer's proposal: outside the signed-in shell (a proposal-link session, no staff sign-in).
        { path: paths.customerProposal, lazy: lazy(() => import('./routes/customer-proposal')) },
        {
          // The signed-in shell: its loader is the auth guard.
          path: paths.home,
          id: 'app',
          lazy: lazy(() => import('./routes/app-root')),
          children: [
            { index: true, lazy: lazy(() => import('./routes/home')) },
            ...createJobsRoutes(queryClient),
            { path: paths.users, lazy: lazy(() => import('./routes/users')) },
            { path: paths.account, lazy: lazy(() => import('./routes/account')) },
            { path: paths.mail, lazy: lazy(() => import('./routes/mail')) },
            { path: paths.outbox, lazy: lazy(() => import('./routes/outbox')) },
            { path: paths.reports, lazy: lazy(() => import('./routes/reports')) },
            { path: paths.priceBook, lazy: lazy(() => import('./routes/price-book')) },
            { path: paths.companySettings, lazy: lazy(() => import('./routes/company-settings')) },
            { path: '*', lazy: lazy(() => import('./routes/not-found')) },
          ],
        },
      ],
    },
  ];
}

export function createAppRouter(queryClient: QueryClient) {
  return createBrowserRouter(createRoutes(queryClient));
}
