import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { UserSchema } from '../users/user.entity';
import { uuidKey } from '../../lib/entity-columns';

/**
 * A password-reset link's token, stored only as its SHA-256 (hex): the database never holds a token
 * that works. Deleted when used (with every other token of the user) and refused after `expiresAt`.
 */
export const PasswordResetTokenSchema = defineEntity({
  name: 'PasswordResetToken',
  tableName: 'password_reset_token',
  properties: {
    id: uuidKey(),
    user: p.manyToOne(UserSchema).deleteRule('cascade').index(),
    tokenHash: p.string().length(64).unique(),
    expiresAt: p.datetime(),
    createdAt: p.datetime(),
  },
});

export type PasswordResetToken = InferEntity<typeof PasswordResetTokenSchema>;
