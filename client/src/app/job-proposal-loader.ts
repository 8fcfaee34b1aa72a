import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { jobQueryOptions } from '../entities/job/queries';
import { proposalQueryOptions } from '../features/proposals/api/get-proposal';
import { jobIdOf } from './job-route-loaders';

/**
 * The proposal screen: the job and its proposal in parallel. The proposal is only prefetched (an installer,
 * whom the page turns away, would get a 403 for it); the page reads it again through the same options.
 */
export const proposalLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const jobId = jobIdOf(params);
    await Promise.all([
      queryClient.ensureQueryData(jobQueryOptions(jobId)),
      queryClient.prefetchQuery(proposalQueryOptions(jobId)),
    ]);
    return null;
  };
