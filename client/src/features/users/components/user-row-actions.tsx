import { errorMessage } from '../../../lib/api-error';
import type { UserRecord } from '@contract';
import { useUpdateUser } from '../api/update-user';
import { EndSessionsButton } from './end-sessions-button';
import { UserActiveToggle } from './user-active-toggle';
import { UserRoleSelect } from './user-role-select';

/** One mutation per row, so a failure shows beside the person it concerns. */
export function useRowUpdate(user: UserRecord) {
  const update = useUpdateUser();
  return {
    pending: update.isPending,
    error: update.error ? errorMessage(update.error) : null,
    setRole: (role: UserRecord['role']) => update.mutate({ id: user.id, role }),
    setActive: (active: boolean) => update.mutate({ id: user.id, active }),
  };
}

export function UserRowActions({ user, isSelf }: { user: UserRecord; isSelf: boolean }) {
  const row = useRowUpdate(user);
  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-center gap-2">
        <UserRoleSelect user={user} disabled={isSelf || row.pending || !user.active} onChange={row.setRole} />
        <UserActiveToggle user={user} disabled={isSelf || row.pending} busy={row.pending} onChange={row.setActive} />
        {user.active ? <EndSessionsButton user={user} isSelf={isSelf} /> : null}
      </div>
      {isSelf ? <p className="text-sm text-muted">This is you. Another owner can change your role.</p> : null}
      {row.error ? (
        <p role="alert" className="text-sm font-semibold text-danger">
          {row.error}
        </p>
      ) : null}
    </div>
  );
}
