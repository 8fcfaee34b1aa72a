import type { EntityManager } from '@mikro-orm/postgresql';
import { ConflictError, NotFoundError, UnprocessableError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import { hashPassword } from '../../services/passwords';
import type { Queue } from '../../services/queue';
import { queueMessage } from '../mail/mail.service';
import { CompanySchema } from '../companies/company.entity';
import { UserSchema, type User } from './user.entity';
import type { CreateUserInput, UpdateUserInput } from './user.schema';

/** Adding a person also queues their welcome e-mail. */
export interface UserContext extends ServiceContext {
  readonly queue: Queue;
}

export function listUsers({ em, actor }: ServiceContext): Promise<User[]> {
  return em.find(UserSchema, { company: actor.companyId }, { orderBy: { name: 'asc' }, populate: ['company'] });
}

/** A user of the actor's company, or 404 — whether the id belongs to another company or to nobody. */
export async function getUser({ em, actor }: ServiceContext, id: string): Promise<User> {
  const user = await em.findOne(UserSchema, { id, company: actor.companyId }, { populate: ['company'] });
  if (!user) throw new NotFoundError('The user');
  return user;
}

export async function createUser({ em, actor, queue }: UserContext, input: CreateUserInput): Promise<User> {
  if (await em.count(UserSchema, { email: input.email }))
    throw new ConflictError('That e-mail address already has an account.');
  const user = em.create(UserSchema, {
    company: em.getReference(CompanySchema, actor.companyId),
    name: input.name,
    email: input.email,
    role: input.role,
    active: true,
    passwordHash: await hashPassword(input.password),
  });
  await em.flush();
  await em.populate(user, ['company']);
  // Queued, not sent: a mail outage neither slows nor undoes the account; the queue retries and the
  // owner's E-mail page shows a message that keeps failing.
  await queueMessage(em, queue, {
    companyId: actor.companyId,
    userId: user.id,
    kind: 'new-user',
    to: user.email,
    subject: `${actor.name} added you to Gaugeline`,
    text: `Hello ${user.name},\n\n${actor.name} created a Gaugeline account for you (role: ${user.role}). Sign in with this e-mail address and the password they gave you, then keep it to yourself.\n`,
  });
  return user;
}

/**
 * Ends every session of a user (deactivation, a password change or reset, the owner's "sign out
 * everywhere"); `exceptSid` keeps one (the session making a change to its own account).
 */
export async function endSessionsOf(em: EntityManager, userId: string, exceptSid?: string): Promise<number> {
  const r = await em
    .getConnection()
    .execute<{ affectedRows?: number }>(
      `delete from "session" where sess->>'userId' = ? and sid <> ?`,
      [userId, exceptSid ?? ''],
      'run',
    );
  return typeof r.affectedRows === 'number' ? r.affectedRows : 0;
}

/** The owner's "sign out everywhere" for one person; for the owner themself, every session but this one. */
export async function endUserSessions(ctx: ServiceContext, id: string, currentSid: string) {
  const { em, actor } = ctx;
  const user = await getUser(ctx, id);
  return endSessionsOf(em, user.id, user.id === actor.userId ? currentSid : undefined);
}

export async function updateUser(ctx: ServiceContext, id: string, input: UpdateUserInput): Promise<User> {
  const { em, actor } = ctx;
  const user = await getUser(ctx, id);
  const losesOwner = user.role === 'owner' && ((input.role && input.role !== 'owner') || input.active === false);
  if (losesOwner) {
    if (user.id === actor.userId)
      throw new UnprocessableError('You cannot remove your own owner access. Ask another owner.');
    const owners = await em.count(UserSchema, { company: actor.companyId, role: 'owner', active: true });
    if (owners <= 1) throw new UnprocessableError('A company needs at least one active owner.');
  }
  if (input.name !== undefined) user.name = input.name;
  if (input.role !== undefined) user.role = input.role;
  const deactivating = input.active === false && user.active;
  if (input.active !== undefined) user.active = input.active;
  await em.flush();
  // loadActor refuses inactive users on every request anyway; deleting the rows also frees the store.
  if (deactivating) await endSessionsOf(em, user.id);
  return user;
}
