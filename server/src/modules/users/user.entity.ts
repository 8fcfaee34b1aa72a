import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { ROLES } from '@contract';
import { CompanySchema } from '../companies/company.entity';

export const UserSchema = defineEntity({
  name: 'User',
  tableName: 'app_user',
  properties: {
    id: p
      .uuid()
      .primary()
      .onCreate(() => randomUUID()),
    company: p.manyToOne(CompanySchema).index(),
    name: p.string().length(120),
    /** Stored lower-cased; unique across the deployment, since sign-in has no company field. */
    email: p.string().length(254).unique(),
    role: p.enum([...ROLES]),
    active: p.boolean().default(true),
    passwordHash: p.string().length(255).hidden(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});

export type User = InferEntity<typeof UserSchema>;
