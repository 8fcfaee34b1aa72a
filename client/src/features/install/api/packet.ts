import { queryOptions } from '@tanstack/react-query';
import { installPacket } from '@contract';
import { jobPath } from '../../../entities/job/paths';
import { apiFetch } from '../../../lib/api-client';

export const packetPath = (jobId: string) => `${jobPath(jobId)}/packet`;
export const packetPdfPath = (jobId: string) => `${packetPath(jobId)}/pdf`;

export const installKeys = { packet: (jobId: string) => ['install', 'packet', jobId] as const };

/** GET the packet (the signed option, no prices). While its PDF is being made the query asks again every 3 s. */
export const packetQueryOptions = (jobId: string) =>
  queryOptions({
    queryKey: installKeys.packet(jobId),
    queryFn: ({ signal }) => apiFetch(packetPath(jobId), { schema: installPacket, signal }),
    staleTime: 30_000,
    refetchInterval: (q) => {
      const state = q.state.data?.pdf.state;
      return state === 'waiting' || state === 'rendering' ? 3000 : false;
    },
  });

/** Asks the server to make the packet's PDF (again). */
export const requestPacketPdf = (jobId: string) =>
  apiFetch(packetPdfPath(jobId), { method: 'POST', schema: installPacket.shape.pdf });
