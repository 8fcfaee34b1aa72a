/** The owner's reports' query keys: one per set of filters as the URL holds them. */
export interface ReportFilters {
  from: string;
  to: string;
  salesperson: string;
}

export const reportKeys = {
  all: ['reports'] as const,
  sales: (f: ReportFilters) => [...reportKeys.all, 'sales', f.from, f.to, f.salesperson] as const,
};

/** The filters from the page's URL (?from=YYYY-MM-DD&to=…&salesperson=id); empty means "any". */
export function filtersFromSearch(params: URLSearchParams): ReportFilters {
  return {
    from: params.get('from') ?? '',
    to: params.get('to') ?? '',
    salesperson: params.get('salesperson') ?? '',
  };
}

/** The same filters as a query string for the API (empty ones left out), without the "?". */
export function filterQuery(f: ReportFilters): string {
  const q = new URLSearchParams();
  if (f.from) q.set('from', f.from);
  if (f.to) q.set('to', f.to);
  if (f.salesperson) q.set('salesperson', f.salesperson);
  return q.toString();
}
