import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes } from 'react';
import { useFormContext, type RegisterOptions } from 'react-hook-form';
import { Button, type ButtonProps } from './button';

const inputClass =
  'block min-h-touch w-full rounded-md border border-line bg-white px-3 text-base text-ink-950 placeholder:text-muted aria-[invalid=true]:border-danger aria-[invalid=true]:bg-danger-soft/40';

interface FieldShellProps {
  id: string;
  label: string;
  hint?: ReactNode;
  error?: string;
  children: ReactNode;
}

function FieldShell({ id, label, hint, error, children }: FieldShellProps) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold text-ink-900">
        {label}
      </label>
      {children}
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-muted">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} className="text-sm font-semibold text-danger">
          {error}
        </p>
      ) : null}
    </div>
  );
}

function useField(name: string, hasHint: boolean) {
  const id = useId();
  const { register, getFieldState, formState } = useFormContext();
  const error = getFieldState(name, formState).error?.message;
  const describedBy = [error ? `${id}-error` : '', hasHint ? `${id}-hint` : ''].filter(Boolean).join(' ');
  return {
    id,
    register,
    error,
    aria: { 'aria-invalid': error ? true : undefined, 'aria-describedby': describedBy || undefined },
  };
}

type TextInputProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'name' | 'id'> & {
  name: string;
  label: string;
  hint?: ReactNode;
};

export function TextField({ name, label, hint, type = 'text', ...rest }: TextInputProps) {
  const { id, register, error, aria } = useField(name, hint !== undefined);
  return (
    <FieldShell id={id} label={label} hint={hint} error={error}>
      <input id={id} type={type} className={inputClass} {...aria} {...rest} {...register(name)} />
    </FieldShell>
  );
}

/**
 * A number typed on a phone keypad. Empty → undefined, text → NaN, so the zod schema
 * (z.number({ message })) gives the message either way.
 */
export function NumberField({ name, label, hint, decimals = true, ...rest }: TextInputProps & { decimals?: boolean }) {
  const { id, register, error, aria } = useField(name, hint !== undefined);
  const options: RegisterOptions = {
    setValueAs: (v: unknown) => (v === '' || v === undefined || v === null ? undefined : Number(v)),
  };
  return (
    <FieldShell id={id} label={label} hint={hint} error={error}>
      <input
        id={id}
        type="text"
        inputMode={decimals ? 'decimal' : 'numeric'}
        autoComplete="off"
        className={inputClass}
        {...aria}
        {...rest}
        {...register(name, options)}
      />
    </FieldShell>
  );
}

type SelectProps = Omit<SelectHTMLAttributes<HTMLSelectElement>, 'name' | 'id'> & {
  name: string;
  label: string;
  hint?: ReactNode;
  options: readonly { value: string; label: string }[];
};

export function SelectField({ name, label, hint, options, ...rest }: SelectProps) {
  const { id, register, error, aria } = useField(name, hint !== undefined);
  return (
    <FieldShell id={id} label={label} hint={hint} error={error}>
      <select id={id} className={inputClass} {...aria} {...rest} {...register(name)}>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </FieldShell>
  );
}

export function SubmitButton({ children, ...rest }: Omit<ButtonProps, 'type'>) {
  const { formState } = useFormContext();
  return (
    <Button type="submit" busy={formState.isSubmitting} {...rest}>
      {children}
    </Button>
  );
}
