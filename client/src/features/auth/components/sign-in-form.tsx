import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useId, useRef, useState, type FormEvent, type InputHTMLAttributes } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { FieldShell, inputClass } from '../../../components/ui/field-shell';
import { isApiError, type FieldError } from '../../../lib/api-error';
import type { SignInInput } from '../schemas';
import { useCountdown } from './use-countdown';

/**
 * The first page a phone opens, so it carries no react-hook-form and no zod (issue 11: sign-in
 * ≤ 120 KB). The contract's rules still check the fields before anything is sent: they come with
 * api/sign-in.ts, fetched as soon as the form has painted — long before anyone finishes typing.
 * This is the one form outside the Form wrapper (DEVELOPERS.md says why); a 400's field errors
 * land on the fields the same way.
 */
const loadSignIn = () => import('../api/sign-in');

type Field = keyof SignInInput;
const FIELDS: readonly Field[] = ['email', 'password'];
const isField = (path: string): path is Field => FIELDS.some((f) => f === path);

function waitText(seconds: number): string {
  if (seconds >= 120) return `${Math.ceil(seconds / 60)} minutes`;
  return seconds === 1 ? '1 second' : `${seconds} seconds`;
}

interface Problem {
  title: string;
  unplaced: FieldError[];
}

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const queryClient = useQueryClient();
  const id = useId();
  const inputs = useRef<Partial<Record<Field, HTMLInputElement | null>>>({});
  const [fieldErrors, setFieldErrors] = useState<Partial<Record<Field, string>>>({});
  const [problem, setProblem] = useState<Problem | null>(null);
  const [busy, setBusy] = useState(false);
  const [lockedUntil, setLockedUntil] = useState<number | null>(null);
  const wait = useCountdown(lockedUntil);

  useEffect(() => {
    void loadSignIn().catch(() => undefined);
  }, []);

  /** Puts errors on their fields (focusing the first); returns those that name no field. */
  const place = (errors: FieldError[]): FieldError[] => {
    const next: Partial<Record<Field, string>> = {};
    const rest: FieldError[] = [];
    for (const e of errors) {
      if (isField(e.path)) next[e.path] ??= e.message;
      else rest.push(e);
    }
    setFieldErrors(next);
    const first = FIELDS.find((f) => next[f] !== undefined);
    if (first) inputs.current[first]?.focus();
    return rest;
  };

  const handleSubmit = async (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const values: SignInInput = {
      email: String(data.get('email') ?? ''),
      password: String(data.get('password') ?? ''),
    };
    setProblem(null);
    setLockedUntil(null);
    setBusy(true);
    try {
      const { checkSignIn, signIn } = await loadSignIn();
      const refused = checkSignIn(values);
      if (refused.length > 0) {
        const rest = place(refused);
        setProblem(rest.length === 0 ? { title: 'Check the highlighted fields.', unplaced: [] } : null);
        return;
      }
      setFieldErrors({});
      await signIn(queryClient, values);
      onSignedIn();
    } catch (e) {
      if (!isApiError(e)) {
        setProblem({ title: 'Something went wrong. Try again.', unplaced: [] });
        return;
      }
      // Too many attempts: say how long to wait and hold the button until then.
      if (e.status === 429) {
        setLockedUntil(Date.now() + (e.retryAfter ?? 60) * 1000);
        return;
      }
      const rest = place(e.errors);
      const placedAll = e.errors.length > 0 && rest.length === 0;
      setProblem({ title: placedAll ? 'Check the highlighted fields.' : e.detail, unplaced: rest });
    } finally {
      setBusy(false);
    }
  };

  const field = (name: Field, label: string, props: InputHTMLAttributes<HTMLInputElement>) => {
    const fieldId = `${id}-${name}`;
    const error = fieldErrors[name];
    return (
      <FieldShell id={fieldId} label={label} error={error}>
        <input
          id={fieldId}
          name={name}
          className={inputClass}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${fieldId}-error` : undefined}
          ref={(el) => {
            inputs.current[name] = el;
          }}
          onChange={() => setFieldErrors((errs) => (errs[name] ? { ...errs, [name]: undefined } : errs))}
          {...props}
        />
      </FieldShell>
    );
  };

  return (
    <form noValidate onSubmit={(e) => void handleSubmit(e)} className="flex flex-col gap-4" aria-label="Sign in">
      {problem ? (
        <Alert tone="danger" title={problem.title}>
          {problem.unplaced.length > 0 ? (
            <ul className="mt-1 list-disc pl-5">
              {problem.unplaced.map((e) => (
                <li key={`${e.path}:${e.message}`}>{e.message}</li>
              ))}
            </ul>
          ) : null}
        </Alert>
      ) : null}
      {wait > 0 ? (
        <Alert tone="warning" title="Too many sign-in attempts">
          For safety, sign-in is paused. Try again in <strong>{waitText(wait)}</strong>.
        </Alert>
      ) : null}
      {field('email', 'E-mail', {
        type: 'email',
        inputMode: 'email',
        autoComplete: 'username',
        autoCapitalize: 'none',
        spellCheck: false,
      })}
      {field('password', 'Password', { type: 'password', autoComplete: 'current-password' })}
      <Button type="submit" className="w-full" busy={busy} disabled={wait > 0}>
        Sign in
      </Button>
    </form>
  );
}
