import { queryOptions } from '@tanstack/react-query';
import { companyDataTableResponse } from '@contract';
import { apiFetch } from '../../../lib/api-client';
import { deskKeys } from '../query-keys';

/** The company's active financing plans (the price book's table; salespeople, estimators and owners read it). */
export const financingQueryOptions = () =>
  queryOptions({
    queryKey: deskKeys.financing(),
    queryFn: async ({ signal }) => {
      const { rows } = await apiFetch('/api/company-data/financing', { schema: companyDataTableResponse, signal });
      return rows
        .filter((r) => r.record.active !== false)
        .map((r) => ({ key: r.key, name: typeof r.record.name === 'string' ? r.record.name : r.key }));
    },
    staleTime: 5 * 60_000,
  });
