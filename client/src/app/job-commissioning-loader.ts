import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { recordQueryOptions } from '../features/commissioning/api/record';
import { ensureHeld } from '../lib/offline/online';
import { jobIdOf } from './job-route-loaders';

/** The commissioning record: what this phone holds (refreshed behind the page when online), else a fetch. */
export const commissioningLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const jobId = jobIdOf(params);
    const options = recordQueryOptions(jobId);
    await ensureHeld(queryClient, options.queryKey, () => queryClient.ensureQueryData(options));
    return null;
  };
