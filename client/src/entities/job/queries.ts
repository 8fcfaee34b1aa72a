import { queryOptions } from '@tanstack/react-query';
import {
  customerResponse,
  jobResponse,
  lossReasonsResponse,
  roomsResponse,
  settingsResponse,
  staffResponse,
} from '@contract';
import { apiFetch } from '../../lib/api-client';
import { COMPANY_SETTINGS_PATH, customerPath, jobPath, LOSS_REASONS_PATH, roomsPath, STAFF_PATH } from './paths';
import { jobKeys } from './query-keys';

/** Read queries for the job records (each parsed with the contract's schema by apiFetch). */
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

export async function getCustomer(customerId: string, signal?: AbortSignal) {
  return (await apiFetch(customerPath(customerId), { schema: customerResponse, signal })).customer;
}

export const customerQueryOptions = (customerId: string) =>
  queryOptions({ queryKey: jobKeys.customer(customerId), queryFn: ({ signal }) => getCustomer(customerId, signal) });

/** GET /api/staff — owner and estimator only; the people a job can be handed to. */
export const staffQueryOptions = () =>
  queryOptions({
    queryKey: jobKeys.staff(),
    queryFn: async ({ signal }) => (await apiFetch(STAFF_PATH, { schema: staffResponse, signal })).staff,
    staleTime: 5 * 60_000,
  });

/**
 * GET /api/company/loss-reasons: the reasons a job may be marked lost with (the defaults until the owner saves).
 * Read by the job's status moves and by the owner's list in the company settings.
 */
export const lossReasonsQueryOptions = () =>
  queryOptions({
    queryKey: jobKeys.lossReasons(),
    queryFn: async ({ signal }) =>
      (await apiFetch(LOSS_REASONS_PATH, { signal, schema: lossReasonsResponse })).lossReasons,
    staleTime: 60_000,
  });
