import { useId, type ReactNode, type TextareaHTMLAttributes } from 'react';
import { useFormContext } from 'react-hook-form';
import { FieldShell, inputClass } from '../../../components/ui/field-shell';

type Props = Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'name' | 'id'> & {
  name: string;
  label: string;
  hint?: ReactNode;
};

/** Several lines of text in the Form (an address, terms): the same label, hint and error as every field. */
export function LongTextField({ name, label, hint, rows = 4, ...rest }: Props) {
  const id = useId();
  const { register, getFieldState, formState } = useFormContext();
  const error = getFieldState(name, formState).error?.message;
  const describedBy = [error ? `${id}-error` : '', hint !== undefined ? `${id}-hint` : ''].filter(Boolean).join(' ');
  return (
    <FieldShell id={id} label={label} hint={hint} error={error}>
      <textarea
        id={id}
        rows={rows}
        className={`${inputClass} py-2 leading-snug`}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy || undefined}
        {...rest}
        {...register(name)}
      />
    </FieldShell>
  );
}
