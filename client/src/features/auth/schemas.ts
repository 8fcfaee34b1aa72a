import { z } from 'zod';
import { changePasswordFields, passwordResetFields, passwordResetRequestBody, signInBody } from '@contract';

/** The server's sign-in body (the contract's), so the page reads the same either way. */
export const signInSchema = signInBody;
export type SignInInput = z.infer<typeof signInSchema>;

const confirmRule = z.string().min(1, { message: 'Type the new password again.' });
const sameTwice = { message: 'The two new passwords are not the same.', path: ['confirmPassword'] };

/** Change password: the contract's fields, plus typing the new one twice (checked here only). */
export const changePasswordFormSchema = z
  .object({ ...changePasswordFields, confirmPassword: confirmRule })
  .refine((v) => v.newPassword === v.confirmPassword, sameTwice);
export type ChangePasswordForm = z.input<typeof changePasswordFormSchema>;

export const forgotPasswordSchema = passwordResetRequestBody;

/** The reset page's form; the token comes from the link, not from a field. */
export const resetPasswordFormSchema = z
  .object({ password: passwordResetFields.password, confirmPassword: confirmRule })
  .refine((v) => v.password === v.confirmPassword, { ...sameTwice });
