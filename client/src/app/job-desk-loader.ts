import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { jobQueryOptions, roomsQueryOptions } from '../entities/job/queries';
import { deskQueryOptions } from '../features/desk/api/get-desk';
import { modelsQueryOptions } from '../features/desk/api/get-models';
import { jobIdOf } from './job-route-loaders';
import { ensureHeld } from '../lib/offline/online';

/** The desk: the job, its rooms (zones pick them), its options and the catalog, in parallel. */
export const deskLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const jobId = jobIdOf(params);
    const job = jobQueryOptions(jobId);
    const rooms = roomsQueryOptions(jobId);
    const desk = deskQueryOptions(jobId);
    const models = modelsQueryOptions();
    // With no signal, what the device holds; nothing held is "No signal" in words at once (lib/offline/online.ts).
    await Promise.all([
      ensureHeld(queryClient, job.queryKey, () => queryClient.ensureQueryData(job)),
      ensureHeld(queryClient, rooms.queryKey, () => queryClient.ensureQueryData(rooms)),
      ensureHeld(queryClient, desk.queryKey, () => queryClient.ensureQueryData(desk)),
      // The pickers must hold the catalog before a stored design is laid into them.
      ensureHeld(queryClient, models.queryKey, () => queryClient.ensureQueryData(models)),
    ]);
    return null;
  };
