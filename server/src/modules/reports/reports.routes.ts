import { salesReportQuery, salesReportResponse } from '@contract';
import { OWNER, rawResponse, type ApiRouter } from '../../lib/route';
import { salesReport, salesReportCsv } from './reports.service';

/** The owner's reports (issue 15), mounted under /api/reports: the owner only (others 403), the owner's company. */
export function reportsRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/sales',
    policy: OWNER,
    summary: 'Win rate, revenue, outstanding, lost reasons and cancellations (filters: from, to, salesperson)',
    query: salesReportQuery,
    response: salesReportResponse,
    handler: async ({ service, query }) => salesReport(service, query),
  });
  api.route({
    method: 'get',
    path: '/sales.csv',
    policy: OWNER,
    summary: 'The same report as CSV (formula cells neutralised)',
    query: salesReportQuery,
    response: rawResponse('text/csv'),
    handler: async ({ service, query, res }) => {
      const report = await salesReport(service, query);
      const name = `sales-report${query.from ? `-from-${query.from}` : ''}${query.to ? `-to-${query.to}` : ''}.csv`;
      res.type('text/csv; charset=utf-8').attachment(name).send(salesReportCsv(report));
      return undefined;
    },
  });
}
