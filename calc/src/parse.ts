import type { z } from 'zod';
import { CalcError } from './errors';

/**
 * The parse boundary: validates `input` with a calc schema and returns the typed output,
 * or throws CalcError('INVALID_INPUT') whose details carry each field path and message.
 */
export function parseOrThrow<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const result = schema.safeParse(input);
  if (result.success) return result.data;
  throw new CalcError(
    'INVALID_INPUT',
    result.error.issues.map((issue) => ({
      path: issue.path.filter((p): p is string | number => typeof p !== 'symbol'),
      message: issue.message,
    })),
  );
}
