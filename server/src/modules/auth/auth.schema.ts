import { z } from 'zod';
import { emailRule, signInPasswordRule } from '@contract';

export const loginSchema = z.strictObject({ email: emailRule, password: signInPasswordRule });
