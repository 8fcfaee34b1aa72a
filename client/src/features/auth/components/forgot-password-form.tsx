import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Alert } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { SubmitButton, TextField } from '../../../components/ui/form-fields';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-error';
import { useRequestPasswordReset } from '../api/passwords';
import { forgotPasswordSchema } from '../schemas';
import { useCountdown } from './use-countdown';

/** Asks for a reset link. The answer is the same whether or not the address has an account. */
export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const [sent, setSent] = useState<string | null>(null);
  const [lockedUntil, setLockedUntil] = useState<number | null>(null);
  const wait = useCountdown(lockedUntil);

  if (sent) {
    return (
      <div className="flex flex-col gap-4">
        <Alert tone="ok" title="Check your e-mail">
          {sent}
        </Alert>
        <p className="text-base text-muted">No e-mail after a few minutes? Look in the spam folder, or ask again.</p>
        <Link to={paths.signIn} className="font-semibold text-ink-800 underline underline-offset-2">
          Back to sign in
        </Link>
      </div>
    );
  }
  return (
    <Form
      schema={forgotPasswordSchema}
      defaultValues={{ email: '' }}
      aria-label="Ask for a reset link"
      onSubmit={async (values) => {
        setLockedUntil(null);
        try {
          setSent((await request.mutateAsync(values)).message);
        } catch (e) {
          if (isApiError(e) && e.status === 429) {
            setLockedUntil(Date.now() + (e.retryAfter ?? 60) * 1000);
            return;
          }
          throw e;
        }
      }}
    >
      {wait > 0 ? (
        <Alert tone="warning" title="Too many requests for a link">
          Try again in {wait >= 120 ? `${Math.ceil(wait / 60)} minutes` : `${wait} seconds`}.
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
      <SubmitButton className="w-full" disabled={wait > 0}>
        Send me a link
      </SubmitButton>
      <Link to={paths.signIn} className="self-start font-semibold text-ink-800 underline underline-offset-2">
        Back to sign in
      </Link>
    </Form>
  );
}
