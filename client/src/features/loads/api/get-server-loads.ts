import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiFetch } from '../../../lib/api-client';
import { jobKeys, jobPath } from '../../../lib/job-queries';

const components = z.looseObject({ total: z.number() });
const roomLoad = z.looseObject({
  roomId: z.string(),
  roomName: z.string(),
  sensibleGain: components,
  latentGain: components,
  heatLoss: components,
  coolingTotalBtuh: z.number(),
});

/** Only what is compared is checked; the rest of calc's HomeLoad passes through untouched. */
export const serverLoadsResponse = z.object({
  jobId: z.string(),
  jobVersion: z.number(),
  tightness: z.string(),
  loads: z.looseObject({
    rooms: z.array(roomLoad),
    totals: z.looseObject({
      sensibleBtuh: z.number(),
      latentBtuh: z.number(),
      coolingBtuh: z.number(),
      heatingBtuh: z.number(),
      sensibleHeatRatio: z.number(),
    }),
  }),
});
export type ServerLoads = z.output<typeof serverLoadsResponse>;

/** GET /api/jobs/:id/loads — the server's own recomputation from the saved inputs. */
export function getServerLoads(jobId: string, signal?: AbortSignal) {
  return apiFetch(`${jobPath(jobId)}/loads`, { schema: serverLoadsResponse, signal });
}

export const serverLoadsQueryOptions = (jobId: string) =>
  queryOptions({
    queryKey: jobKeys.serverLoads(jobId),
    queryFn: ({ signal }) => getServerLoads(jobId, signal),
    retry: false,
  });

export function useServerLoads(jobId: string) {
  return useQuery(serverLoadsQueryOptions(jobId));
}
