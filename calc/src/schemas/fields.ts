import { z } from 'zod';
import { FACINGS } from '../solar/facings';

/**
 * Field builders shared by every calc schema so each bound has one human message,
 * shown by the client next to the field and returned by the server in 400 details.
 */

/** A number between `min` and `max` (inclusive) with the message "<Label> must be between min and max <unit>". */
export function bounded(label: string, min: number, max: number, unit = '') {
  const suffix = unit ? ` ${unit}` : '';
  const message = `${label} must be between ${min} and ${max}${suffix}`;
  // The same checks as `.min(min, message).max(max, message)`, in that order, added in one step: each
  // `.min`/`.max` makes a new copy of the schema, and the walk-through's first screen builds hundreds of
  // these fields when it loads (issue 11).
  return z.number({ error: `${label}: enter a number` }).check(z.gte(min, message), z.lte(max, message));
}

/** A whole number between `min` and `max`. */
export function boundedInt(label: string, min: number, max: number, unit = '') {
  return bounded(label, min, max, unit).int(`${label} must be a whole number`);
}

/** A short required name. */
export function nameField(label: string, max = 80) {
  return z
    .string({ error: `${label}: enter text` })
    .trim()
    .min(1, `Enter a ${label.toLowerCase()}`)
    .max(max, `${label} must be at most ${max} characters`);
}

/** A stable key (letters, digits, dashes, underscores, dots, slashes, colons). */
export function keyField(label: string) {
  return z
    .string({ error: `${label}: enter text` })
    .min(1, `Enter a ${label.toLowerCase()}`)
    .max(80, `${label} must be at most 80 characters`)
    .regex(/^[A-Za-z0-9._:/-]+$/, `${label} may use letters, digits, dots, dashes, slashes and colons only`);
}

/** Compass directions a wall or window can face. */
export const compassDirectionSchema = z.enum(FACINGS, {
  error: 'Choose a direction: N, NE, E, SE, S, SW, W or NW',
});
