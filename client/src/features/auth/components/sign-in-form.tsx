import { useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { SubmitButton, TextField } from '../../../components/ui/form-fields';
import { isApiError } from '../../../lib/api-error';
import { useSignIn } from '../api/sign-in';
import { signInSchema } from '../schemas';
import { useCountdown } from './use-countdown';

function waitText(seconds: number): string {
  if (seconds >= 120) return `${Math.ceil(seconds / 60)} minutes`;
  return seconds === 1 ? '1 second' : `${seconds} seconds`;
}

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const signIn = useSignIn();
  const [lockedUntil, setLockedUntil] = useState<number | null>(null);
  const wait = useCountdown(lockedUntil);

  return (
    <Form
      schema={signInSchema}
      defaultValues={{ email: '', password: '' }}
      aria-label="Sign in"
      onSubmit={async (values) => {
        setLockedUntil(null);
        try {
          await signIn.mutateAsync(values);
        } catch (e) {
          // Too many attempts: say how long to wait and hold the button until then.
          if (isApiError(e) && e.status === 429) {
            setLockedUntil(Date.now() + (e.retryAfter ?? 60) * 1000);
            return;
          }
          throw e;
        }
        onSignedIn();
      }}
    >
      {wait > 0 ? (
        <Alert tone="warning" title="Too many sign-in attempts">
          For safety, sign-in is paused. Try again in <strong>{waitText(wait)}</strong>.
        </Alert>
      ) : null}
      <TextField
        name="email"
        label="E-mail"
        type="email"
        inputMode="email"
        autoComplete="username"
        autoCapitalize="none"
        spellCheck={false}
      />
      <TextField name="password" label="Password" type="password" autoComplete="current-password" />
      <SubmitButton className="w-full" disabled={wait > 0}>
        Sign in
      </SubmitButton>
    </Form>
  );
}
