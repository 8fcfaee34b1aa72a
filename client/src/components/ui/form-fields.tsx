import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes } from 'react';
import { useFormContext, type RegisterOptions } from 'react-hook-form';
import { Button, type ButtonProps } from './button';
import { FieldShell, inputClass, SelectOptions } from './field-shell';

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
        <SelectOptions options={options} />
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
