import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { ROLES } from '@contract';
import { CompanySchema } from '../companies/company.entity';
import { timestamps, uuidKey } from '../../lib/entity-columns';

export const UserSchema = defineEntity({
  name: 'User',
  tableName: 'app_user',
  properties: {
    id: uuidKey(),
    company: p.manyToOne(CompanySchema).index(),
    name: p.string().length(120),
    /** Stored lower-cased; unique across the deployment, since sign-in has no company field. */
    email: p.string().length(254).unique(),
    role: p.enum([...ROLES]),
    active: p.boolean().default(true),
    passwordHash: p.string().length(255).hidden(),
    ...timestamps(),
  },
});

export type User = InferEntity<typeof UserSchema>;
