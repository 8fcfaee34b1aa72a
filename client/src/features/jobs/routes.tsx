import type { QueryClient } from '@tanstack/react-query';
import type { RouteObject } from 'react-router-dom';
import { RouteError } from '../../components/errors/route-error';
import { jobRoutePatterns } from '../../lib/job-paths';

/**
 * The job screens. This file composes the jobs, walk-through and loads features (the one place
 * they meet). It is part of the router, which every page loads first (sign-in too), so it holds
 * only paths: each route's loader (route-loaders.ts: zod, the job queries, the offline queue)
 * and page load lazily and in parallel (React Router's lazy object), only where they are used.
 */
const loaders = () => import('./route-loaders');

export function createJobsRoutes(queryClient: QueryClient): RouteObject[] {
  const jobWithRooms = async () => (await loaders()).jobWithRoomsLoader(queryClient);
  return [
    {
      path: jobRoutePatterns.list,
      ErrorBoundary: RouteError,
      lazy: {
        loader: async () => (await loaders()).jobsListLoader(queryClient),
        Component: async () => (await import('./waiting-pages')).JobsListRoute,
      },
    },
    {
      path: jobRoutePatterns.new,
      ErrorBoundary: RouteError,
      lazy: { Component: async () => (await import('./components/new-job-page')).NewJobPage },
    },
    {
      path: jobRoutePatterns.walkthrough,
      ErrorBoundary: RouteError,
      lazy: {
        loader: jobWithRooms,
        Component: async () => (await import('../walkthrough/components/walkthrough-page')).WalkthroughPage,
      },
    },
    {
      path: jobRoutePatterns.loads,
      ErrorBoundary: RouteError,
      lazy: {
        loader: jobWithRooms,
        Component: async () => (await import('./waiting-pages')).LoadsRoute,
      },
    },
    {
      path: jobRoutePatterns.print,
      ErrorBoundary: RouteError,
      lazy: {
        loader: jobWithRooms,
        Component: async () => (await import('../loads/components/load-print-page')).LoadPrintPage,
      },
    },
  ];
}
