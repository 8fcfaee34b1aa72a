import { z } from 'zod';
import { emailRule, signInPasswordRule } from '@contract';
import { companySchema, userSchema } from '../../types/user';

export const meSchema = z.object({ user: userSchema, company: companySchema });
export type Me = z.infer<typeof meSchema>;

/** The server's sign-in rules (the contract's), so the page reads the same either way. */
export const signInSchema = z.object({ email: emailRule, password: signInPasswordRule });
export type SignInInput = z.infer<typeof signInSchema>;
