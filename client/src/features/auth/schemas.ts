import { z } from 'zod';
import { companySchema, userSchema } from '../../types/user';

export const meSchema = z.object({ user: userSchema, company: companySchema });
export type Me = z.infer<typeof meSchema>;

/** Mirrors the server's loginSchema messages so the page reads the same either way. */
export const signInSchema = z.object({
  email: z
    .string()
    .trim()
    .min(1, { message: 'Enter an e-mail address.' })
    .pipe(z.email({ message: 'Enter a valid e-mail address.' })),
  password: z.string().min(1, { message: 'Enter your password.' }).max(512, { message: 'Password is too long.' }),
});
export type SignInInput = z.infer<typeof signInSchema>;
