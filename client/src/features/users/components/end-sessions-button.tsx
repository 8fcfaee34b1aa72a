import { Button } from '../../../components/ui/button';
import { errorMessage } from '../../../lib/api-error';
import type { UserRecord } from '@contract';
import { useEndSessions } from '../api/end-sessions';

function endedText(n: number, isSelf: boolean): string {
  const where = isSelf ? 'other ' : '';
  if (n === 0) return isSelf ? 'You were not signed in anywhere else.' : 'Was not signed in anywhere.';
  return n === 1 ? `Signed out of 1 ${where}device.` : `Signed out of ${n} ${where}devices.`;
}

/** "Sign out everywhere": for a lost phone or a shared tablet left signed in. */
export function EndSessionsButton({ user, isSelf }: { user: UserRecord; isSelf: boolean }) {
  const end = useEndSessions();
  return (
    <div className="flex flex-col gap-1">
      <Button
        variant="secondary"
        busy={end.isPending}
        disabled={!user.active}
        aria-label={`Sign ${isSelf ? 'yourself' : user.name} out everywhere`}
        onClick={() => end.mutate(user.id)}
      >
        {isSelf ? 'Sign out other devices' : 'Sign out everywhere'}
      </Button>
      {end.isSuccess ? (
        <p role="status" className="text-sm text-ok">
          {endedText(end.data, isSelf)}
        </p>
      ) : null}
      {end.error ? (
        <p role="alert" className="text-sm font-semibold text-danger">
          {errorMessage(end.error)}
        </p>
      ) : null}
    </div>
  );
}
