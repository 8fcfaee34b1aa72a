import { flexRender, type Table } from '@tanstack/react-table';

interface Classes {
  row?: string;
  cell?: string;
}

/** The header rows of a TanStack table; each feature keeps its own columns and layout. */
export function DataTableHead<T>({
  table,
  className,
  rowClassName,
  cellClassName,
}: {
  table: Table<T>;
  className?: string;
  rowClassName?: string;
  cellClassName?: string;
}) {
  return (
    <thead className={className}>
      {table.getHeaderGroups().map((hg) => (
        <tr key={hg.id} className={rowClassName}>
          {hg.headers.map((h) => (
            <th key={h.id} scope="col" className={cellClassName}>
              {flexRender(h.column.columnDef.header, h.getContext())}
            </th>
          ))}
        </tr>
      ))}
    </thead>
  );
}

/** The body rows of a TanStack table. */
export function DataTableBody<T>({ table, classes = {} }: { table: Table<T>; classes?: Classes }) {
  return (
    <tbody>
      {table.getRowModel().rows.map((row) => (
        <tr key={row.id} className={classes.row}>
          {row.getVisibleCells().map((cell) => (
            <td key={cell.id} className={classes.cell}>
              {flexRender(cell.column.columnDef.cell, cell.getContext())}
            </td>
          ))}
        </tr>
      ))}
    </tbody>
  );
}
