import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { DataTableBody, DataTableHead } from '../../../components/ui/data-table';
import { Link } from 'react-router-dom';
import { jobPaths } from '../../../entities/job/paths';
import { type JobRecord } from '@contract';
import { jobStatusText } from '../../../entities/job/labels';
import { ReadyBadge, showsReadyMark } from './ready-badge';

const col = createColumnHelper<JobRecord>();
const when = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short' });

const columns = [
  col.accessor((j) => j.customer.name, {
    id: 'customer',
    header: 'Customer',
    cell: (c) => (
      <Link
        className="font-semibold text-ink-800 underline underline-offset-2"
        to={jobPaths.walkthrough(c.row.original.id)}
      >
        {c.getValue()}
      </Link>
    ),
  }),
  col.accessor((j) => [j.site.street, j.site.unit, j.site.city].filter(Boolean).join(', '), {
    id: 'address',
    header: 'Site address',
  }),
  col.accessor('status', {
    header: 'Status',
    cell: (c) => (
      <span className="flex flex-col items-start gap-1">
        {jobStatusText(c.row.original)}
        <ReadyBadge job={c.row.original} />
      </span>
    ),
  }),
  col.accessor((j) => j.salesperson?.name ?? '—', { id: 'salesperson', header: 'Salesperson' }),
  col.accessor('lastActivityAt', { header: 'Last activity', cell: (c) => when.format(new Date(c.getValue())) }),
];

interface Props {
  jobs: readonly JobRecord[];
  total: number;
  page: number;
  pageSize: number;
  onPage: (page: number) => void;
}

/** Server-paginated: the table shows one page; the URL carries the page number. */
export function JobsTable({ jobs, total, page, pageSize, onPage }: Props) {
  const pageCount = Math.max(1, Math.ceil(total / pageSize));
  const table = useReactTable({
    data: [...jobs],
    columns,
    getCoreRowModel: getCoreRowModel(),
    manualPagination: true,
    pageCount,
    state: { pagination: { pageIndex: page - 1, pageSize } },
  });
  return (
    <div className="flex flex-col gap-3">
      {/* Phones get one card per job; wider screens the table. Both come from the same rows. */}
      <ul aria-label="Jobs" className="flex flex-col gap-2 sm:hidden">
        {table.getRowModel().rows.map((row) => {
          const j = row.original;
          return (
            <li key={row.id}>
              <Link
                to={jobPaths.walkthrough(j.id)}
                className="flex min-h-touch flex-col rounded-lg border border-line bg-white px-4 py-3"
              >
                <span className="font-semibold text-ink-800">{j.customer.name}</span>
                <span className="text-sm text-ink-950">
                  {[j.site.street, j.site.unit, j.site.city].filter(Boolean).join(', ')}
                </span>
                <span className="text-sm text-muted">
                  {jobStatusText(j)} · {when.format(new Date(j.lastActivityAt))}
                </span>
                {showsReadyMark(j) ? (
                  <span className="mt-1">
                    <ReadyBadge job={j} />
                  </span>
                ) : null}
              </Link>
            </li>
          );
        })}
      </ul>
      <div className="hidden overflow-x-auto rounded-lg border border-line bg-white sm:block">
        <table className="w-full min-w-[640px] text-left">
          <DataTableHead
            table={table}
            className="bg-ink-50 text-sm text-ink-900"
            cellClassName="px-3 py-2 font-semibold"
          />
          <DataTableBody table={table} classes={{ row: 'border-t border-line', cell: 'px-3 py-3' }} />
        </table>
      </div>
      <nav aria-label="Pages" className="flex items-center justify-between gap-2">
        <button
          type="button"
          className="min-h-touch whitespace-nowrap rounded-md border border-line bg-white px-3 disabled:opacity-50"
          disabled={page <= 1}
          onClick={() => onPage(page - 1)}
        >
          Previous page
        </button>
        <span className="text-center text-sm text-muted">
          Page {page} of {pageCount} · {total} {total === 1 ? 'job' : 'jobs'}
        </span>
        <button
          type="button"
          className="min-h-touch whitespace-nowrap rounded-md border border-line bg-white px-3 disabled:opacity-50"
          disabled={page >= pageCount}
          onClick={() => onPage(page + 1)}
        >
          Next page
        </button>
      </nav>
    </div>
  );
}
