import type { QueryClient } from '@tanstack/react-query';
import type { RouteObject } from 'react-router-dom';
import { RouteError } from '../components/errors/route-error';
import { jobRoutePatterns } from '../entities/job/paths';

/**
 * The job screens. This file is part of the router, which every page loads first (sign-in too), so
 * it holds only paths: each route's loader (job-route-loaders.ts: zod, the job queries, the offline
 * queue; the desk's in job-desk-loader.ts) and page (app/routes/job-*.tsx, where the features are composed) load lazily and in
 * parallel (React Router's lazy object), only where they are used.
 */
const loaders = () => import('./job-route-loaders');

export function createJobsRoutes(queryClient: QueryClient): RouteObject[] {
  const jobWithRooms = async () => (await loaders()).jobWithRoomsLoader(queryClient);
  return [
    {
      path: jobRoutePatterns.list,
      ErrorBoundary: RouteError,
      lazy: {
        loader: async () => (await loaders()).jobsListLoader(queryClient),
        Component: async () => (await import('./routes/jobs')).default,
      },
    },
    {
      path: jobRoutePatterns.new,
      ErrorBoundary: RouteError,
      lazy: { Component: async () => (await import('./routes/job-new')).default },
    },
    {
      path: jobRoutePatterns.walkthrough,
      ErrorBoundary: RouteError,
      lazy: { loader: jobWithRooms, Component: async () => (await import('./routes/job-walkthrough')).default },
    },
    {
      path: jobRoutePatterns.loads,
      ErrorBoundary: RouteError,
      lazy: { loader: jobWithRooms, Component: async () => (await import('./routes/job-loads')).default },
    },
    {
      path: jobRoutePatterns.desk,
      ErrorBoundary: RouteError,
      lazy: {
        loader: async () => (await import('./job-desk-loader')).deskLoader(queryClient),
        Component: async () => (await import('./routes/job-desk')).default,
      },
    },
    {
      path: jobRoutePatterns.proposal,
      ErrorBoundary: RouteError,
      lazy: {
        loader: async () => (await import('./job-proposal-loader')).proposalLoader(queryClient),
        Component: async () => (await import('./routes/job-proposal')).default,
      },
    },
    {
      path: jobRoutePatterns.packet,
      ErrorBoundary: RouteError,
      lazy: {
        loader: async () => (await import('./job-packet-loader')).packetLoader(queryClient),
        Component: async () => (await import('./routes/job-packet')).default,
      },
    },
    {
      path: jobRoutePatterns.commissioning,
      ErrorBoundary: RouteError,
      lazy: {
        loader: async () => (await import('./job-commissioning-loader')).commissioningLoader(queryClient),
        Component: async () => (await import('./routes/job-commissioning')).default,
      },
    },
    {
      path: jobRoutePatterns.print,
      ErrorBoundary: RouteError,
      lazy: { loader: jobWithRooms, Component: async () => (await import('./routes/job-loads-print')).default },
    },
  ];
}
