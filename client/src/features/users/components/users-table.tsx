import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { DataTableBody, DataTableHead } from '../../../components/ui/data-table';
import { useMemo } from 'react';
import type { UserRecord } from '@contract';
import { useUsers } from '../api/get-users';
import { UserRowActions } from './user-row-actions';

const col = createColumnHelper<UserRecord>();

export function UsersTable({ currentUserId }: { currentUserId: string }) {
  const users = useUsers();
  const columns = useMemo(
    () => [
      col.accessor('name', { header: 'Name', cell: (c) => <span className="font-semibold">{c.getValue()}</span> }),
      col.accessor('email', { header: 'E-mail', cell: (c) => <span className="break-all">{c.getValue()}</span> }),
      col.accessor('active', {
        header: 'Status',
        cell: (c) =>
          c.getValue() ? (
            <span className="rounded-sm bg-ok-soft px-2 py-0.5 text-sm font-semibold text-ok">Active</span>
          ) : (
            <span className="rounded-sm bg-amber-soft px-2 py-0.5 text-sm font-semibold text-amber-deep">
              Deactivated
            </span>
          ),
      }),
      col.display({
        id: 'actions',
        header: 'Role and access',
        cell: (c) => <UserRowActions user={c.row.original} isSelf={c.row.original.id === currentUserId} />,
      }),
    ],
    [currentUserId],
  );
  const table = useReactTable({ data: users, columns, getCoreRowModel: getCoreRowModel(), getRowId: (u) => u.id });

  // Phone: each row becomes a card (headers become inline labels); desktop: a plain table.
  return (
    <table className="w-full border-collapse text-left text-base">
      <caption className="sr-only">People who can sign in to your company</caption>
      <DataTableHead
        table={table}
        className="max-md:sr-only"
        rowClassName="border-b border-line"
        cellClassName="px-3 py-2 text-sm font-semibold text-muted"
      />
      <DataTableBody
        table={table}
        classes={{
          row: 'border-b border-line max-md:mb-3 max-md:block max-md:rounded-lg max-md:border max-md:bg-white max-md:p-3',
          cell: 'px-3 py-3 align-top max-md:block max-md:px-0 max-md:py-1',
        }}
      />
    </table>
  );
}
