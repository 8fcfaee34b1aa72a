import { PASSWORD_HINT } from '@contract';
import { useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { SubmitButton, TextField } from '../../../components/ui/form-fields';
import { useChangePassword } from '../api/passwords';
import { changePasswordFormSchema, type ChangePasswordForm } from '../schemas';

const empty: ChangePasswordForm = { currentPassword: '', newPassword: '', confirmPassword: '' };

function endedText(n: number): string {
  if (n === 0) return 'You were not signed in anywhere else.';
  return n === 1 ? 'One other device was signed out.' : `${n} other devices were signed out.`;
}

/** Your own password: the current one first; other devices are signed out, this one stays. */
export function ChangePasswordForm() {
  const change = useChangePassword();
  const [done, setDone] = useState<string | null>(null);
  return (
    <div className="flex max-w-md flex-col gap-4">
      {done ? (
        <Alert tone="ok" title="Your password is changed.">
          {done} We e-mailed you a note about the change.
        </Alert>
      ) : null}
      <Form
        schema={changePasswordFormSchema}
        defaultValues={empty}
        resetOnSuccess
        aria-label="Change your password"
        onSubmit={async ({ currentPassword, newPassword }) => {
          setDone(null);
          const r = await change.mutateAsync({ currentPassword, newPassword });
          setDone(endedText(r.endedSessions));
        }}
      >
        <TextField name="currentPassword" label="Current password" type="password" autoComplete="current-password" />
        <TextField
          name="newPassword"
          label="New password"
          type="password"
          autoComplete="new-password"
          hint={PASSWORD_HINT}
        />
        <TextField name="confirmPassword" label="New password again" type="password" autoComplete="new-password" />
        <div>
          <SubmitButton>Change password</SubmitButton>
        </div>
      </Form>
    </div>
  );
}
