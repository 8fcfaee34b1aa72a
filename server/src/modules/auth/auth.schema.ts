import { z } from 'zod';

export const emailSchema = z
  .string({ message: 'Enter an e-mail address.' })
  .trim()
  .max(254, { message: 'E-mail must be at most 254 characters.' })
  .pipe(z.email({ message: 'Enter a valid e-mail address.' }))
  .transform((e) => e.toLowerCase());

/** Length is counted in code points, so an emoji counts as one character (ASVS 6.2.1). */
export const newPasswordSchema = z
  .string({ message: 'Enter a password.' })
  .refine((p) => [...p].length >= 12, { message: 'Password must be at least 12 characters.' })
  .refine((p) => [...p].length <= 128, { message: 'Password must be at most 128 characters.' });

export const loginSchema = z.strictObject({
  email: emailSchema,
  // Over-long passwords are refused before any hashing work.
  password: z
    .string({ message: 'Enter your password.' })
    .min(1, { message: 'Enter your password.' })
    .max(512, { message: 'Password is too long.' }),
});
