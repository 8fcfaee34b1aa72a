import { z } from 'zod';
import { emailRule, newPasswordRule, PASSWORD_MAX, PASSWORD_MIN, signInPasswordRule } from './fields';

/** Accounts: changing one's password, the e-mailed reset link, and the e-mail the app sends. */

/** What the new-password fields say about length, from the one pair of bounds. */
export const PASSWORD_HINT = `${PASSWORD_MIN} to ${PASSWORD_MAX} characters. A short sentence is easy to remember and hard to guess.`;

/** How long a password-reset link works, from the moment its e-mail is sent. */
export const RESET_LINK_MINUTES = 30;
/** The link's token: 32 random bytes (256 bits) in base64url, so always 43 characters. */
export const RESET_TOKEN_LENGTH = 43;

export const changePasswordFields = {
  currentPassword: signInPasswordRule,
  newPassword: newPasswordRule,
};

export const passwordResetRequestFields = { email: emailRule };

export const passwordResetFields = {
  token: z
    .string({ message: 'The link is not complete: open it again from the e-mail.' })
    .regex(new RegExp(`^[A-Za-z0-9_-]{${RESET_TOKEN_LENGTH}}$`), {
      message: 'The link is not complete: open it again from the e-mail.',
    }),
  password: newPasswordRule,
};

/** The request bodies of sign-in, changing one's password, asking for a reset link and using it (strict: the server
 * refuses any other key; the client's forms check the same objects before sending). */
export const signInBody = z.strictObject({ email: emailRule, password: signInPasswordRule });
export const changePasswordBody = z.strictObject(changePasswordFields);
export const passwordResetRequestBody = z.strictObject(passwordResetRequestFields);
export const passwordResetBody = z.strictObject(passwordResetFields);

/** The same answer whether or not an account uses the address (nobody learns who has one). */
export const RESET_REQUESTED_MESSAGE = `If an account uses that address, an e-mail with a link to set a new password is on its way. The link works for ${RESET_LINK_MINUTES} minutes.`;
export const RESET_LINK_INVALID = 'This link has expired or has already been used. Ask for a new one.';

/**
 * 'password-reset' and 'proposal-link' are stored without a body: their one-time link is made as they are sent.
 * 'signed-proposal': the customer's signed, sealed copy of a proposal (attached).
 */
export const MESSAGE_KINDS = [
  'new-user',
  'password-changed',
  'password-reset',
  'proposal-link',
  'signed-proposal',
] as const;
export type MessageKind = (typeof MESSAGE_KINDS)[number];
/** waiting → sent; a failed try → retrying (the queue tries again later) → … → failed after the last try. */
export const MESSAGE_STATES = ['waiting', 'retrying', 'failed', 'sent'] as const;
export type MessageState = (typeof MESSAGE_STATES)[number];

/** An e-mail as the owner's E-mail page sees it: who, what about and how delivery went, never its body. */
export const mailMessageRecord = z.object({
  id: z.string(),
  kind: z.enum(MESSAGE_KINDS),
  to: z.string(),
  subject: z.string(),
  state: z.enum(MESSAGE_STATES),
  /** Tries so far (0 after "Try again" until the next one). */
  attempts: z.number().int(),
  lastError: z.string().nullable(),
  nextAttemptAt: z.string().nullable(),
  sentAt: z.string().nullable(),
  createdAt: z.string(),
});
export type MailMessageRecord = z.output<typeof mailMessageRecord>;
export const mailMessagesResponse = z.object({ messages: z.array(mailMessageRecord) });
export const mailMessageResponse = z.object({ message: mailMessageRecord });

export const passwordChangedResponse = z.object({ endedSessions: z.number().int() });
export const sessionsEndedResponse = z.object({ ended: z.number().int() });
/** The words of "forgot password" and of a completed reset. */
export const accountMessageResponse = z.object({ message: z.string() });
