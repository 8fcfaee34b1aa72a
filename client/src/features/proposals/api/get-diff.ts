import { queryOptions } from '@tanstack/react-query';
import { proposalDiffResponse } from '@contract';
import { apiFetch } from '../../../lib/api-client';
import { proposalKeys } from '../query-keys';
import { versionPath } from './get-proposal';

/** GET …/versions/:a/diff/:b — what changed from version a to version b, in sentences (frozen: kept). */
export const diffQueryOptions = (jobId: string, from: number, to: number) =>
  queryOptions({
    queryKey: proposalKeys.diff(jobId, from, to),
    queryFn: ({ signal }) =>
      apiFetch(`${versionPath(jobId, from)}/diff/${to}`, { schema: proposalDiffResponse, signal }),
    // Versions never change, so neither does what changed between two of them.
    staleTime: Infinity,
  });
