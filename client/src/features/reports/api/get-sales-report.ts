import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { salesReportResponse } from '@contract';
import { apiFetch } from '../../../lib/api-client';
import { filterQuery, reportKeys, type ReportFilters } from '../query-keys';

export const salesReportPath = '/api/reports/sales';
/** The CSV of the same figures (a plain link: the browser downloads it with the session's cookie). */
export const salesReportCsvHref = (f: ReportFilters) => {
  const q = filterQuery(f);
  return `/api/reports/sales.csv${q ? `?${q}` : ''}`;
};

/** GET /api/reports/sales?from&to&salesperson — the owner only; the server checks the filters (400 with why). */
export async function getSalesReport(f: ReportFilters, signal?: AbortSignal) {
  const q = filterQuery(f);
  return apiFetch(`${salesReportPath}${q ? `?${q}` : ''}`, { schema: salesReportResponse, signal });
}

export const salesReportQueryOptions = (f: ReportFilters) =>
  queryOptions({
    queryKey: reportKeys.sales(f),
    queryFn: ({ signal }) => getSalesReport(f, signal),
    placeholderData: keepPreviousData,
    // A 400 (bad filters in the URL) will not mend by asking again.
    retry: false,
  });

export function useSalesReport(f: ReportFilters) {
  return useQuery(salesReportQueryOptions(f));
}
