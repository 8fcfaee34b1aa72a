import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import type { UserRecord } from '@contract';

interface Props {
  user: UserRecord;
  disabled: boolean;
  busy: boolean;
  onChange: (active: boolean) => void;
}

/** Deactivating ends the person's sessions, so it asks first; reactivating does not. */
export function UserActiveToggle({ user, disabled, busy, onChange }: Props) {
  const [confirming, setConfirming] = useState(false);
  if (!user.active) {
    return (
      <Button variant="secondary" disabled={disabled} busy={busy} onClick={() => onChange(true)}>
        Reactivate
      </Button>
    );
  }
  if (!confirming) {
    return (
      <Button variant="secondary" disabled={disabled} onClick={() => setConfirming(true)}>
        Deactivate
      </Button>
    );
  }
  return (
    <div
      role="group"
      aria-label={`Confirm deactivating ${user.name}`}
      className="flex flex-col gap-2 rounded-md bg-amber-soft p-2"
    >
      <p className="text-sm text-ink-950">
        {user.name} will be signed out everywhere and cannot sign in until reactivated.
      </p>
      <div className="flex flex-wrap gap-2">
        <Button
          variant="danger"
          busy={busy}
          onClick={() => {
            onChange(false);
            setConfirming(false);
          }}
        >
          Deactivate {user.name}
        </Button>
        <Button variant="ghost" onClick={() => setConfirming(false)}>
          Keep active
        </Button>
      </div>
    </div>
  );
}
