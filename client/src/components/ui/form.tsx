import { zodResolver } from '@hookform/resolvers/zod';
import { useState, type ReactNode } from 'react';
import {
  FormProvider,
  useForm,
  type DefaultValues,
  type FieldValues,
  type Path,
  type UseFormReturn,
} from 'react-hook-form';
import type { z } from 'zod';
import { isApiError, type FieldError } from '../../lib/api-error';
import { Alert } from './alert';

type Schema = z.ZodType<FieldValues, FieldValues>;
export type FormApi<S extends Schema> = UseFormReturn<z.input<S>, unknown, z.output<S>>;

export interface FormProps<S extends Schema> {
  /** Prefer the same zod schema the server validates with. */
  schema: S;
  /** Give every field a default: server errors are matched against these names. */
  defaultValues: DefaultValues<z.input<S>>;
  /** Throw (or let the API client throw) an ApiError: its field errors land on the fields. */
  onSubmit: (values: z.output<S>, form: FormApi<S>) => Promise<void> | void;
  children: ReactNode | ((form: FormApi<S>) => ReactNode);
  className?: string;
  'aria-label'?: string;
  resetOnSuccess?: boolean;
}

/** Every dotted path to a leaf of the form's values ("name", "rooms.0.width"). */
function leafPaths(value: unknown, prefix = ''): string[] {
  if (value !== null && typeof value === 'object' && !(value instanceof Date) && !(value instanceof File)) {
    const entries = Array.isArray(value) ? value.map((v, i) => [String(i), v] as const) : Object.entries(value);
    const paths = entries.flatMap(([k, v]) => leafPaths(v, prefix ? `${prefix}.${k}` : k));
    return prefix ? [prefix, ...paths] : paths;
  }
  return prefix ? [prefix] : [];
}

function isPath<T extends FieldValues>(known: ReadonlySet<string>, p: string): p is Path<T> {
  return known.has(p);
}

export function Form<S extends Schema>({
  schema,
  defaultValues,
  onSubmit,
  children,
  className = '',
  resetOnSuccess = false,
  ...aria
}: FormProps<S>) {
  const form = useForm<z.input<S>, unknown, z.output<S>>({ resolver: zodResolver(schema), defaultValues });
  const [unplaced, setUnplaced] = useState<FieldError[]>([]);

  const applyServerErrors = (errors: FieldError[]): FieldError[] => {
    const known = new Set(leafPaths(form.getValues()));
    const rest: FieldError[] = [];
    let focused = false;
    for (const e of errors) {
      if (isPath<z.input<S>>(known, e.path)) {
        form.setError(e.path, { type: 'server', message: e.message }, { shouldFocus: !focused });
        focused = true;
      } else rest.push(e);
    }
    return rest;
  };

  const handleSubmit = form.handleSubmit(async (values) => {
    setUnplaced([]);
    try {
      await onSubmit(values, form);
      if (resetOnSuccess) form.reset();
    } catch (e) {
      if (!isApiError(e)) {
        form.setError('root.server', { type: 'server', message: 'Something went wrong. Try again.' });
        return;
      }
      const rest = applyServerErrors(e.errors);
      setUnplaced(rest);
      const placedAll = e.errors.length > 0 && rest.length === 0;
      form.setError('root.server', { type: e.code, message: placedAll ? 'Check the highlighted fields.' : e.detail });
    }
  });

  const rootError = form.formState.errors.root?.server?.message;
  return (
    <FormProvider {...form}>
      <form noValidate onSubmit={handleSubmit} className={`flex flex-col gap-4 ${className}`} {...aria}>
        {rootError ? (
          <Alert tone="danger" title={rootError}>
            {unplaced.length > 0 ? (
              <ul className="mt-1 list-disc pl-5">
                {unplaced.map((e) => (
                  <li key={`${e.path}:${e.message}`}>{e.message}</li>
                ))}
              </ul>
            ) : null}
          </Alert>
        ) : null}
        {typeof children === 'function' ? children(form) : children}
      </form>
    </FormProvider>
  );
}
