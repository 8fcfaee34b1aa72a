import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { z } from 'zod';
import { companySettingsQueryOptions, jobQueryOptions, roomsQueryOptions } from '../entities/job/queries';
import { jobsQueryOptions } from '../features/jobs/api/get-jobs';
import { filtersFromSearch } from '../features/jobs/components/jobs-filters';
import { sharedWalkthroughQueue } from '../features/walkthrough/sync/walkthrough-queue';
import { getCurrentPerson } from '../lib/offline/person';
import { ensureHeld } from '../lib/offline/online';

/**
 * The job screens' loaders. They live apart from job-routes.tsx so that the router (in the entry
 * chunk every page loads, sign-in included) does not carry the offline kit, zod and the job
 * queries: React Router loads this module beside the page's component (issue 11). The desk's loader
 * is in job-desk-loader.ts, so the walk-through does not download the desk's records.
 */
const jobIdParams = z.object({ jobId: z.uuid() });

export function jobIdOf(params: LoaderFunctionArgs['params']): string {
  const parsed = jobIdParams.safeParse(params);
  if (!parsed.success) throw new Response('Not found', { status: 404, statusText: 'Not found' });
  return parsed.data.jobId;
}

export const jobsListLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) => {
    // Starting the queue replays what an earlier visit left waiting.
    if (getCurrentPerson()) sharedWalkthroughQueue(queryClient);
    void queryClient.prefetchQuery(jobsQueryOptions(filtersFromSearch(new URL(request.url).searchParams)));
    return null;
  };

export const jobWithRoomsLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const jobId = jobIdOf(params);
    if (getCurrentPerson()) sharedWalkthroughQueue(queryClient);
    void queryClient.prefetchQuery(companySettingsQueryOptions());
    const job = jobQueryOptions(jobId);
    const rooms = roomsQueryOptions(jobId);
    // With no signal and nothing held on the phone: words at once, not a fetch paused forever.
    await Promise.all([
      ensureHeld(queryClient, job.queryKey, () => queryClient.ensureQueryData(job)),
      ensureHeld(queryClient, rooms.queryKey, () => queryClient.ensureQueryData(rooms)),
    ]);
    return null;
  };
