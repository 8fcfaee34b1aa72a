import {
  createColumnHelper,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import type { CsvColumn } from '@calc';
import { DataTableBody, DataTableHead } from '../../../components/ui/data-table';
import { columnHeading, isNumericCell } from '../model/table-view';
import type { CompanyDataRowRecord as DataRow } from '@contract';

type GridRow = { key: string; cells: Record<string, string>; row: DataRow };
const col = createColumnHelper<GridRow>();

const compareCells = (a: string, b: string) =>
  isNumericCell(a) && isNumericCell(b) ? Number(a) - Number(b) : a.localeCompare(b, 'en', { numeric: true });

interface Props {
  rows: readonly DataRow[];
  columns: readonly CsvColumn[];
  search: string;
  selectedKey: string | null;
  onOpen: (key: string) => void;
  label: string;
}

/** One table of the catalog or price book: sortable, filtered by the search text; a row opens the side panel. */
export function DataGrid({ rows, columns, search, selectedKey, onOpen, label }: Props) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const data = useMemo(
    () =>
      rows.map((row) => ({
        key: row.key,
        row,
        cells: Object.fromEntries(columns.map((c) => [c.name, c.read(row.record)])),
      })),
    [rows, columns],
  );
  const tableColumns = useMemo(
    () =>
      columns.map((c, i) =>
        col.accessor((r) => r.cells[c.name] ?? '', {
          id: c.name,
          header: ({ column }) => (
            <button
              type="button"
              className="inline-flex min-h-touch items-center gap-1 whitespace-nowrap text-left font-semibold"
              onClick={column.getToggleSortingHandler()}
              title={c.help}
            >
              {columnHeading(c.name)}
              <span aria-hidden="true">
                {column.getIsSorted() === 'asc' ? '▲' : column.getIsSorted() === 'desc' ? '▼' : ''}
              </span>
            </button>
          ),
          sortingFn: (a, b, id) => compareCells(String(a.getValue(id)), String(b.getValue(id))),
          cell: (ctx) =>
            i === 0 ? (
              <button
                type="button"
                className="min-h-touch text-left font-semibold text-ink-800 underline underline-offset-2"
                onClick={() => onOpen(ctx.row.original.key)}
              >
                {ctx.getValue()}
              </button>
            ) : (
              <span className={isNumericCell(ctx.getValue()) ? 'tabular-nums' : ''}>{ctx.getValue() || '—'}</span>
            ),
        }),
      ),
    [columns, onOpen],
  );
  const table = useReactTable({
    data,
    columns: tableColumns,
    state: { sorting, globalFilter: search },
    onSortingChange: setSorting,
    globalFilterFn: (row, _id, value: string) =>
      Object.values(row.original.cells).some((c) => c.toLowerCase().includes(value.trim().toLowerCase())),
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  const shown = table.getRowModel().rows;
  const [first, second, third] = columns;
  return (
    <div className="flex flex-col gap-2">
      <p className="text-sm text-muted" aria-live="polite">
        {shown.length} of {rows.length} shown
      </p>
      <ul aria-label={label} className="flex flex-col gap-2 md:hidden">
        {shown.map(({ original: r }) => (
          <li key={r.key}>
            <button
              type="button"
              onClick={() => onOpen(r.key)}
              className={`flex min-h-touch w-full flex-col rounded-lg border bg-white px-4 py-3 text-left ${selectedKey === r.key ? 'border-ink-600' : 'border-line'}`}
            >
              <span className="font-semibold text-ink-800">{first ? r.cells[first.name] : r.key}</span>
              <span className="text-sm text-ink-950">{second ? r.cells[second.name] : ''}</span>
              {third ? <span className="text-sm text-muted">{r.cells[third.name]}</span> : null}
            </button>
          </li>
        ))}
      </ul>
      <div className="hidden overflow-x-auto rounded-lg border border-line bg-white md:block">
        <table className="w-full text-left text-sm" aria-label={label}>
          <DataTableHead table={table} className="bg-ink-50 text-ink-900" cellClassName="px-3 py-1" />
          <DataTableBody table={table} classes={{ row: 'border-t border-line', cell: 'px-3 py-1 align-middle' }} />
        </table>
      </div>
      {shown.length === 0 ? <p className="text-base text-muted">Nothing matches the search.</p> : null}
    </div>
  );
}
