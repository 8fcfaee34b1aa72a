import { useId, type ReactNode } from 'react';
import {
  useController,
  useFormContext,
  type ControllerRenderProps,
  type FieldValues,
  type RefCallBack,
} from 'react-hook-form';
import { FieldShell, inputClass } from '../../../components/ui/field-shell';

/** What a desk field's label, hint and error need from its caller. */
export interface FieldFrameProps {
  name: string;
  label: string;
  hint?: string;
}

/**
 * What the control inside the frame takes as it is: the id its label points at, the form's ref and name,
 * the shared look, and the error (else the hint) it is described by.
 */
export interface ControlProps {
  id: string;
  ref: RefCallBack;
  name: string;
  className: string;
  'aria-invalid': true | undefined;
  'aria-describedby': string | undefined;
}

/**
 * The desk's one field frame: a form value held through the form (controlled), with its label, hint and
 * error around the control `children` draws (an input or a select) from the field and its `ControlProps`.
 */
export function ControlledField({
  name,
  label,
  hint,
  children,
}: FieldFrameProps & {
  children: (field: ControllerRenderProps<FieldValues, string>, control: ControlProps) => ReactNode;
}) {
  const id = useId();
  const { control } = useFormContext();
  const { field, fieldState } = useController({ name, control });
  const error = fieldState.error?.message;
  return (
    <FieldShell id={id} label={label} hint={hint} error={error}>
      {children(field, {
        id,
        ref: field.ref,
        name: field.name,
        className: inputClass,
        'aria-invalid': error ? true : undefined,
        'aria-describedby': error ? `${id}-error` : hint ? `${id}-hint` : undefined,
      })}
    </FieldShell>
  );
}
