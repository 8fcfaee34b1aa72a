import { z, type ZodError, type ZodType } from 'zod';
import { ValidationError, type FieldError } from './errors';

export function zodToFieldErrors(err: ZodError): FieldError[] {
  return err.issues.map((i) => ({
    path: i.path.map(String).join('.') || '(body)',
    message: i.message,
  }));
}

/** Parses untrusted input with a schema; a failure becomes a 400 naming each field. */
export function parseInput<S extends ZodType>(schema: S, value: unknown, prefix = ''): z.output<S> {
  const r = schema.safeParse(value);
  if (r.success) return r.data;
  const errors = zodToFieldErrors(r.error).map((e) => ({
    ...e,
    path: prefix && e.path === '(body)' ? prefix : e.path,
  }));
  throw new ValidationError(errors);
}

export const uuidParam = z.uuid({ message: 'Must be an id.' });
