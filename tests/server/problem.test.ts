import { describe, expect, it } from 'vitest';
import { CalcError } from '@calc';
import { ZodError, z } from 'zod';
import { toAppError } from '../../server/src/lib/problem';

describe('toAppError maps what libraries throw onto the problem vocabulary', () => {
  it('a calc error becomes 422 "calc" with its constant message and field paths', () => {
    const e = toAppError(
      new CalcError('INVALID_INPUT', [
        { path: ['rooms', 0, 'lengthFt'], message: 'Length must be between 1 and 200 ft' },
      ]),
    );
    expect(e?.status).toBe(422);
    expect(e?.code).toBe('calc');
    expect(e?.extra).toEqual({
      errors: [{ path: 'rooms.0.lengthFt', message: 'Length must be between 1 and 200 ft' }],
    });
  });

  it('a zod error becomes 400 with each field', () => {
    const r = z.object({ a: z.number({ message: 'A must be a number.' }) }).safeParse({ a: 'x' });
    expect(r.success).toBe(false);
    const e = toAppError(r.error instanceof ZodError ? r.error : new Error('no'));
    expect(e?.status).toBe(400);
    expect(e?.extra).toEqual({ errors: [{ path: 'a', message: 'A must be a number.' }] });
  });

  it('an unknown error stays unknown (the handler answers a generic 500)', () => {
    expect(toAppError(new Error('secret detail'))).toBeUndefined();
  });
});
