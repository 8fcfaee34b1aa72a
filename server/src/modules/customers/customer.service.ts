import { ConflictError, DuplicateError, NotFoundError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import { CompanySchema } from '../companies/company.entity';
import { JobSchema } from '../jobs/job.entity';
import { assertVersion } from '../../lib/version-lock';
import { stampOf } from '../../lib/change-stamp';
import { presentCustomer } from './customer.presenter';
import { CustomerSchema, type Customer } from './customer.entity';
import {
  likePattern,
  type CreateCustomerInput,
  type ListCustomersQuery,
  type UpdateCustomerInput,
} from './customer.schema';

export async function listCustomers(
  { em, actor }: ServiceContext,
  q: ListCustomersQuery,
): Promise<{ items: Customer[]; total: number }> {
  const pat = q.search ? likePattern(q.search) : undefined;
  const where = pat
    ? {
        company: actor.companyId,
        $or: [{ name: { $ilike: pat } }, { email: { $ilike: pat } }, { phone: { $ilike: pat } }],
      }
    : { company: actor.companyId };
  const [items, total] = await em.findAndCount(CustomerSchema, where, {
    orderBy: { name: 'asc', id: 'asc' },
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  return { items, total };
}

export async function getCustomer({ em, actor }: ServiceContext, id: string): Promise<Customer> {
  const c = await em.findOne(CustomerSchema, { id, company: actor.companyId });
  if (!c) throw new NotFoundError('The customer');
  return c;
}

/** Phone numbers are compared by their digits; fewer than seven is too short to say two are the same. */
const phoneDigits = (phone: string | null | undefined) => (phone ?? '').replace(/\D/g, '');
const MIN_PHONE_DIGITS = 7;

/**
 * A customer of the actor's company with this e-mail (any case) or phone (same digits), the e-mail's match
 * first; null when none. Only the actor's company is searched: another company's customers never match.
 */
export async function findSameCustomer(
  { em, actor }: ServiceContext,
  email: string | null | undefined,
  phone: string | null | undefined,
): Promise<{ customer: Customer; matched: 'email' | 'phone' } | null> {
  const mail = email?.trim().toLowerCase() || null;
  const digits = phoneDigits(phone);
  const tel = digits.length >= MIN_PHONE_DIGITS ? digits : null;
  if (!mail && !tel) return null;
  const [row] = await em.execute<{ id: string; by_email: boolean }[]>(
    `select id, (?::text is not null and lower(email) = ?::text) as by_email from "customer"
     where company_id = ? and ((?::text is not null and lower(email) = ?::text)
       or (?::text is not null and regexp_replace(coalesce(phone, ''), '[^0-9]', '', 'g') = ?::text))
     order by by_email desc, created_at, id limit 1`,
    [mail, mail, actor.companyId, mail, mail, tel, tel],
  );
  if (!row) return null;
  const customer = await em.findOneOrFail(CustomerSchema, { id: row.id, company: actor.companyId });
  return { customer, matched: row.by_email ? 'email' : 'phone' };
}

export async function createCustomer(ctx: ServiceContext, input: CreateCustomerInput): Promise<Customer> {
  const { em, actor } = ctx;
  if (!input.createAnyway) {
    const same = await findSameCustomer(ctx, input.email, input.phone);
    if (same) {
      const { customer: c, matched } = same;
      throw new DuplicateError(
        'Use the existing customer?',
        `${c.name} already has this ${matched === 'email' ? 'e-mail address' : 'phone number'}. Use that customer, or send createAnyway: true to add a second one.`,
        {
          existing: { id: c.id, name: c.name, email: c.email ?? null, phone: c.phone ?? null },
          matched,
        },
      );
    }
  }
  const c = em.create(CustomerSchema, {
    company: em.getReference(CompanySchema, actor.companyId),
    name: input.name,
    email: input.email ?? null,
    phone: input.phone ?? null,
    notes: input.notes ?? '',
    ...stampOf(actor),
  });
  await em.flush();
  return c;
}

export async function updateCustomer(
  ctx: ServiceContext,
  id: string,
  version: number,
  input: UpdateCustomerInput,
): Promise<Customer> {
  const c = await getCustomer(ctx, id);
  assertVersion(version, c.version, 'The customer', () => presentCustomer(c));
  if (input.name !== undefined) c.name = input.name;
  if (input.email !== undefined) c.email = input.email;
  if (input.phone !== undefined) c.phone = input.phone;
  if (input.notes !== undefined) c.notes = input.notes;
  Object.assign(c, stampOf(ctx.actor));
  await ctx.em.flush();
  return c;
}

/** A customer with jobs stays: the jobs (and later proposals) need who they were for. */
export async function deleteCustomer(ctx: ServiceContext, id: string, version: number): Promise<void> {
  const { em } = ctx;
  const c = await getCustomer(ctx, id);
  assertVersion(version, c.version, 'The customer', () => presentCustomer(c));
  if (await em.count(JobSchema, { customer: c.id }))
    throw new ConflictError('This customer has jobs; it cannot be deleted.');
  em.remove(c);
  await em.flush();
}
