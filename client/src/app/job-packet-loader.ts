import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { packetQueryOptions } from '../features/install/api/packet';
import { jobIdOf } from './job-route-loaders';

/** The job packet (issue 15): fetched before the page shows. */
export const packetLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    await queryClient.ensureQueryData(packetQueryOptions(jobIdOf(params)));
    return null;
  };
