import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from './api-client';
import { jobResponse, roomsResponse, settingsResponse } from '@contract';

/**
 * Query keys and read queries for the job records that the jobs, walk-through and loads
 * features share (one key factory, so an edit in one invalidates the others' views).
 */
export interface JobListFilters {
  readonly search: string;
  readonly status: string;
  readonly page: number;
  readonly pageSize: number;
}

export const jobKeys = {
  all: ['jobs'] as const,
  lists: () => [...jobKeys.all, 'list'] as const,
  list: (filters: JobListFilters) => [...jobKeys.lists(), filters] as const,
  detail: (jobId: string) => [...jobKeys.all, 'detail', jobId] as const,
  rooms: (jobId: string) => [...jobKeys.detail(jobId), 'rooms'] as const,
  serverLoads: (jobId: string) => [...jobKeys.detail(jobId), 'loads'] as const,
  customers: (search: string) => [...jobKeys.all, 'customers', search] as const,
  settings: () => ['company-settings'] as const,
};

export const jobPath = (jobId: string) => `/api/jobs/${encodeURIComponent(jobId)}`;
export const roomsPath = (jobId: string) => `${jobPath(jobId)}/rooms`;
export const roomPath = (jobId: string, roomId: string) => `${roomsPath(jobId)}/${encodeURIComponent(roomId)}`;
export const COMPANY_SETTINGS_PATH = '/api/company/settings';

export async function getJob(jobId: string, signal?: AbortSignal) {
  return (await apiFetch(jobPath(jobId), { schema: jobResponse, signal })).job;
}

export const jobQueryOptions = (jobId: string) =>
  queryOptions({ queryKey: jobKeys.detail(jobId), queryFn: ({ signal }) => getJob(jobId, signal) });

/**
 * A refetch that left before this tab's own write landed answers with the older room; keep the
 * newer version we already hold, so the screen (and the next edit made on it) never goes back.
 */
export function keepNewerRooms(old: unknown, fresh: unknown): unknown {
  if (!Array.isArray(old) || !Array.isArray(fresh)) return fresh;
  const held = new Map<unknown, unknown>(old.map((r: { id?: unknown }) => [r.id, r]));
  return fresh.map((r: { id?: unknown; version?: unknown }) => {
    const mine = held.get(r.id);
    const newer =
      typeof mine === 'object' &&
      mine !== null &&
      'version' in mine &&
      typeof mine.version === 'number' &&
      typeof r.version === 'number' &&
      mine.version > r.version;
    return newer ? mine : r;
  });
}

export const roomsQueryOptions = (jobId: string) =>
  queryOptions({
    queryKey: jobKeys.rooms(jobId),
    queryFn: async ({ signal }) => (await apiFetch(roomsPath(jobId), { schema: roomsResponse, signal })).rooms,
    structuralSharing: keepNewerRooms,
  });

export const companySettingsQueryOptions = () =>
  queryOptions({
    queryKey: jobKeys.settings(),
    queryFn: async ({ signal }) =>
      (await apiFetch(COMPANY_SETTINGS_PATH, { schema: settingsResponse, signal })).settings,
    staleTime: 5 * 60_000,
  });
