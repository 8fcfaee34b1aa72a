import { queryOptions } from '@tanstack/react-query';
import { lossReasonsResponse } from '@contract';
import { jobKeys } from '../../../entities/job/query-keys';
import { apiFetch } from '../../../lib/api-client';

/** GET /api/company/loss-reasons: the reasons a job may be marked lost with (the defaults until the owner saves). */
export const lossReasonsQueryOptions = () =>
  queryOptions({
    queryKey: jobKeys.lossReasons(),
    queryFn: async ({ signal }) =>
      (await apiFetch('/api/company/loss-reasons', { signal, schema: lossReasonsResponse })).lossReasons,
    staleTime: 60_000,
  });
