import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { jobQueryOptions, roomsQueryOptions } from '../entities/job/queries';
import { deskQueryOptions } from '../features/desk/api/get-desk';
import { modelsQueryOptions } from '../features/desk/api/get-models';
import { jobIdOf } from './job-route-loaders';

/** The desk: the job, its rooms (zones pick them), its options and the catalog, in parallel. */
export const deskLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const jobId = jobIdOf(params);
    await Promise.all([
      queryClient.ensureQueryData(jobQueryOptions(jobId)),
      queryClient.ensureQueryData(roomsQueryOptions(jobId)),
      queryClient.ensureQueryData(deskQueryOptions(jobId)),
      // The pickers must hold the catalog before a stored design is laid into them.
      queryClient.ensureQueryData(modelsQueryOptions()),
    ]);
    return null;
  };
