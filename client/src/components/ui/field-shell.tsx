import type { ReactNode } from 'react';

export const inputClass =
  'block min-h-touch w-full rounded-md border border-line bg-white px-3 text-base text-ink-950 placeholder:text-muted aria-[invalid=true]:border-danger aria-[invalid=true]:bg-danger-soft/40';

export interface FieldShellProps {
  id: string;
  label: string;
  hint?: ReactNode;
  error?: string | undefined;
  /** A unit shown beside the input (the walk-through's measures: "ft", "m²"); none when empty. */
  unit?: string;
  /** Classes for the field's own box (a grid cell's span). */
  className?: string | undefined;
  children: ReactNode;
}

/** A field's label, hint and error around its input: the Form's fields use it, and so does the sign-in page, which has no react-hook-form. */
export function FieldShell({ id, label, hint, error, unit, className, children }: FieldShellProps) {
  return (
    <div className={`flex min-w-0 flex-col gap-1${className ? ` ${className}` : ''}`}>
      <label htmlFor={id} className="text-sm font-semibold text-ink-900">
        {label}
      </label>
      {!unit ? (
        children
      ) : (
        <div className="flex items-center gap-2">
          {children}
          <span id={`${id}-unit`} className="min-w-8 text-sm text-muted">
            {unit}
          </span>
        </div>
      )}
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

export interface SelectOption {
  readonly value: string;
  readonly label: string;
}

/** The `<option>`s of a select from value/label pairs: every select of the app lists them this way. */
export function SelectOptions({ options }: { options: readonly SelectOption[] }) {
  return (
    <>
      {options.map((o) => (
        <option key={o.value} value={o.value}>
          {o.label}
        </option>
      ))}
    </>
  );
}
