import { PASSWORD_HINT } from '@contract';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Alert } from '../../../components/ui/alert';
import { buttonClass } from '../../../components/ui/button';
import { Form } from '../../../components/ui/form';
import { SubmitButton, TextField } from '../../../components/ui/form-fields';
import { paths } from '../../../config/paths';
import { useCompletePasswordReset } from '../api/passwords';
import { resetPasswordFormSchema } from '../schemas';

/**
 * Reads the link's token from the URL fragment once and takes it out of the address bar (and so out
 * of the history), so it is not left on screen or sent anywhere.
 */
function useTokenFromFragment(): string | null {
  const [token] = useState(() => {
    const found = new URLSearchParams(window.location.hash.replace(/^#/, '')).get('token');
    if (found) window.history.replaceState(window.history.state, '', window.location.pathname);
    return found;
  });
  return token;
}

export function ResetPasswordForm() {
  const token = useTokenFromFragment();
  const complete = useCompletePasswordReset();
  const [done, setDone] = useState(false);

  if (!token) {
    return (
      <div className="flex flex-col gap-4">
        <Alert tone="warning" title="This page needs the link from the e-mail">
          Open the link in the e-mail again, or ask for a new one.
        </Alert>
        <Link to={paths.forgotPassword} className={buttonClass('primary', 'w-full')}>
          Ask for a new link
        </Link>
      </div>
    );
  }
  if (done) {
    return (
      <div className="flex flex-col gap-4">
        <Alert tone="ok" title="Your new password is set.">
          Every device that was signed in to your account has been signed out. Sign in with the new password.
        </Alert>
        <Link to={paths.signIn} className={buttonClass('primary', 'w-full')}>
          Sign in
        </Link>
      </div>
    );
  }
  return (
    <Form
      schema={resetPasswordFormSchema}
      defaultValues={{ password: '', confirmPassword: '' }}
      aria-label="Set a new password"
      onSubmit={async ({ password }) => {
        await complete.mutateAsync({ token, password });
        setDone(true);
      }}
    >
      <TextField
        name="password"
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={PASSWORD_HINT}
      />
      <TextField name="confirmPassword" label="New password again" type="password" autoComplete="new-password" />
      <SubmitButton className="w-full">Set new password</SubmitButton>
      <Link to={paths.forgotPassword} className="self-start font-semibold text-ink-800 underline underline-offset-2">
        Ask for a new link
      </Link>
    </Form>
  );
}
