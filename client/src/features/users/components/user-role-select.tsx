import { useId } from 'react';
import { ROLES, type Role, type UserRecord } from '@contract';
import { roleLabels } from '../../../config/roles';

function isRole(v: string): v is Role {
  return ROLES.some((r) => r === v);
}

interface Props {
  user: UserRecord;
  disabled: boolean;
  onChange: (role: Role) => void;
}

export function UserRoleSelect({ user, disabled, onChange }: Props) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="sr-only">
        Role for {user.name}
      </label>
      <select
        id={id}
        value={user.role}
        disabled={disabled}
        onChange={(e) => {
          if (isRole(e.target.value)) onChange(e.target.value);
        }}
        className="min-h-touch rounded-md border border-line bg-white px-2 text-base disabled:bg-ink-50 disabled:text-muted"
      >
        {ROLES.map((r) => (
          <option key={r} value={r}>
            {roleLabels[r]}
          </option>
        ))}
      </select>
    </div>
  );
}
