import { z } from 'zod';
import {
  changePasswordFields,
  emailRule,
  passwordResetFields,
  passwordResetRequestFields,
  signInPasswordRule,
} from '@contract';

export const loginSchema = z.strictObject({ email: emailRule, password: signInPasswordRule });
export const changePasswordSchema = z.strictObject(changePasswordFields);
export const passwordResetRequestSchema = z.strictObject(passwordResetRequestFields);
export const passwordResetSchema = z.strictObject(passwordResetFields);
