import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs, RouteObject } from 'react-router-dom';
import { z } from 'zod';
import { RouteError } from '../../components/errors/route-error';
import { jobRoutePatterns } from '../../lib/job-paths';
import { companySettingsQueryOptions, jobQueryOptions, roomsQueryOptions } from '../../lib/job-queries';
import { getCurrentPerson } from '../../lib/offline/person';
import { queryClient as sharedQueryClient } from '../../lib/query-client';
import { sharedWalkthroughQueue } from '../walkthrough/sync/walkthrough-queue';
import { jobsQueryOptions } from './api/get-jobs';
import { filtersFromSearch } from './components/jobs-filters';

/**
 * The job screens. This file composes the jobs, walk-through and loads features (the one
 * place they meet); pages load lazily so the chart library loads only where it is used.
 */
const jobIdParams = z.object({ jobId: z.uuid() });

function jobIdOf(params: LoaderFunctionArgs['params']): string {
  const parsed = jobIdParams.safeParse(params);
  if (!parsed.success) throw new Response('Not found', { status: 404, statusText: 'Not found' });
  return parsed.data.jobId;
}

export function createJobsRoutes(queryClient: QueryClient): RouteObject[] {
  const jobWithRooms = async ({ params }: LoaderFunctionArgs) => {
    const jobId = jobIdOf(params);
    // Starting the queue replays what an earlier visit left waiting.
    if (getCurrentPerson()) sharedWalkthroughQueue(queryClient);
    void queryClient.prefetchQuery(companySettingsQueryOptions());
    await Promise.all([
      queryClient.ensureQueryData(jobQueryOptions(jobId)),
      queryClient.ensureQueryData(roomsQueryOptions(jobId)),
    ]);
    return null;
  };
  return [
    {
      path: jobRoutePatterns.list,
      ErrorBoundary: RouteError,
      loader: ({ request }) => {
        if (getCurrentPerson()) sharedWalkthroughQueue(queryClient);
        void queryClient.prefetchQuery(jobsQueryOptions(filtersFromSearch(new URL(request.url).searchParams)));
        return null;
      },
      lazy: async () => ({ Component: (await import('./components/jobs-list-page')).JobsListPage }),
    },
    {
      path: jobRoutePatterns.new,
      ErrorBoundary: RouteError,
      lazy: async () => ({ Component: (await import('./components/new-job-page')).NewJobPage }),
    },
    {
      path: jobRoutePatterns.walkthrough,
      ErrorBoundary: RouteError,
      loader: jobWithRooms,
      lazy: async () => ({ Component: (await import('../walkthrough/components/walkthrough-page')).WalkthroughPage }),
    },
    {
      path: jobRoutePatterns.loads,
      ErrorBoundary: RouteError,
      loader: jobWithRooms,
      lazy: async () => ({ Component: (await import('../loads/components/loads-page')).LoadsPage }),
    },
    {
      path: jobRoutePatterns.print,
      ErrorBoundary: RouteError,
      loader: jobWithRooms,
      lazy: async () => ({ Component: (await import('../loads/components/load-print-page')).LoadPrintPage }),
    },
  ];
}

/** The routes on the app's shared query client (client/src/lib/query-client.ts). */
export const jobsRoutes: RouteObject[] = createJobsRoutes(sharedQueryClient);
