import { useEffect, useRef } from 'react';
import { Button } from '../../components/ui/button';

export function waitingChangesText(count: number): string {
  return count === 1
    ? '1 change has not reached the office — sign out anyway?'
    : `${count} changes have not reached the office — sign out anyway?`;
}

/**
 * Asked before signing out while changes still wait on this device. Signing out anyway keeps
 * them in this person's own storage: nobody else's session sends them, and they go on their way
 * when the same person signs in again.
 */
export function SignOutQuestion({
  count,
  onStay,
  onSignOut,
  busy,
}: {
  count: number;
  onStay: () => void;
  onSignOut: () => void;
  busy: boolean;
}) {
  const stay = useRef<HTMLButtonElement>(null);
  useEffect(() => stay.current?.focus(), []);
  return (
    <div
      role="alertdialog"
      aria-labelledby="sign-out-question"
      aria-describedby="sign-out-question-detail"
      className="mb-6 flex flex-col gap-3 rounded-md border-l-4 border-amber-line bg-amber-soft px-4 py-3 text-amber-deep"
    >
      <p id="sign-out-question" className="font-semibold">
        {waitingChangesText(count)}
      </p>
      <p id="sign-out-question-detail" className="text-ink-950">
        They stay on this device, kept for you alone, and are sent when you sign in here again. Anyone else who signs in
        here will not see or send them.
      </p>
      <div className="flex flex-wrap gap-2">
        <Button ref={stay} onClick={onStay}>
          Stay signed in
        </Button>
        <Button variant="secondary" busy={busy} onClick={onSignOut}>
          Sign out anyway
        </Button>
      </div>
    </div>
  );
}
