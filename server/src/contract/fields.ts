import { z } from 'zod';
import { ROLES } from './enums';

/**
 * Field rules with their words, the same in the browser's forms and the server's request schemas.
 * The server wraps them in strict objects (create/update); the forms compose them with their own UI fields.
 */

export const requiredText = (label: string, max: number) =>
  z
    .string({ message: `Enter the ${label}.` })
    .trim()
    .min(1, { message: `Enter the ${label}.` })
    .max(max, { message: `The ${label} must be at most ${max} characters.` });

export const emailRule = z
  .string({ message: 'Enter an e-mail address.' })
  .trim()
  .min(1, { message: 'Enter an e-mail address.' })
  .toLowerCase()
  .max(254, { message: 'E-mail must be at most 254 characters.' })
  .pipe(z.email({ message: 'Enter a valid e-mail address.' }));

/** Length is counted in code points, so an emoji counts as one character (ASVS 6.2.1). */
export const PASSWORD_MIN = 12;
export const PASSWORD_MAX = 128;
export const newPasswordRule = z
  .string({ message: 'Enter a password.' })
  .refine((p) => [...p].length >= PASSWORD_MIN, { message: `Password must be at least ${PASSWORD_MIN} characters.` })
  .refine((p) => [...p].length <= PASSWORD_MAX, { message: `Password must be at most ${PASSWORD_MAX} characters.` });
/** Signing in: over-long passwords are refused before any hashing work. */
export const SIGN_IN_PASSWORD_MAX = 512;
export const signInPasswordRule = z
  .string({ message: 'Enter your password.' })
  .min(1, { message: 'Enter your password.' })
  .max(SIGN_IN_PASSWORD_MAX, { message: 'Password is too long.' });

export const userRules = {
  name: z
    .string({ message: 'Enter a name.' })
    .trim()
    .min(1, { message: 'Enter a name.' })
    .max(120, { message: 'Name must be at most 120 characters.' }),
  email: emailRule,
  role: z.enum(ROLES, { message: `Role must be one of: ${ROLES.join(', ')}.` }),
  password: newPasswordRule,
};

const notes = z
  .string({ message: 'Notes must be text.' })
  .max(4000, { message: 'Notes must be at most 4000 characters.' });

export const customerRules = {
  name: z
    .string({ message: 'Enter the customer name.' })
    .trim()
    .min(1, { message: 'Enter the customer name.' })
    .max(160, { message: 'Name must be at most 160 characters.' }),
  email: emailRule,
  phone: z
    .string({ message: 'Enter a phone number.' })
    .trim()
    .regex(/^\+?[0-9][0-9 ().-]{5,38}$/, {
      message: 'Enter a phone number using digits, spaces, dashes, dots or brackets.',
    }),
  notes,
};

/** A job's site and notes. */
export const siteRules = {
  street: requiredText('street address', 200),
  unit: z
    .string({ message: 'The unit must be text.' })
    .trim()
    .max(60, { message: 'The unit must be at most 60 characters.' }),
  city: requiredText('city or town', 100),
  region: requiredText('state or region', 60),
  postalCode: z
    .string({ message: 'Enter the postal code.' })
    .trim()
    .regex(/^[A-Za-z0-9][A-Za-z0-9 -]{1,18}$/, { message: 'Enter a postal code (letters, digits, spaces or dashes).' }),
  notes,
};

/** Blank text in a form means "not given"; the server takes null (or leaves the field out) for those. */
export const blankOr = <S extends z.ZodType<string, string>>(rule: S) => z.union([z.literal(''), rule]);
