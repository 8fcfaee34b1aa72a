import { apiFetch } from '../../../lib/api-client';
import { ApiError } from '../../../lib/api-error';
import { customerResponse } from '@contract';

export interface CreateCustomerBody {
  name: string;
  email?: string | null;
  phone?: string | null;
  notes?: string;
  /** Make it even though a customer of the company has the same e-mail or phone (else 409 `duplicate`). */
  createAnyway?: boolean;
}

/** The customer a 409 `duplicate` names: the one with the same e-mail or phone. */
export interface SameCustomer {
  id: string;
  name: string;
  email: string | null;
  phone: string | null;
}

/** The existing customer a "Use the existing customer?" answer names, or null for any other error. */
export function sameCustomerOf(e: unknown): SameCustomer | null {
  if (!(e instanceof ApiError) || e.status !== 409 || e.code !== 'duplicate') return null;
  const c = e.extra.existing;
  if (typeof c !== 'object' || c === null) return null;
  const id: unknown = Reflect.get(c, 'id');
  const name: unknown = Reflect.get(c, 'name');
  const email: unknown = Reflect.get(c, 'email');
  const phone: unknown = Reflect.get(c, 'phone');
  if (typeof id !== 'string' || typeof name !== 'string') return null;
  return {
    id,
    name,
    email: typeof email === 'string' ? email : null,
    phone: typeof phone === 'string' ? phone : null,
  };
}

/** POST /api/customers. */
export async function createCustomer(body: CreateCustomerBody) {
  return (await apiFetch('/api/customers', { method: 'POST', body, schema: customerResponse })).customer;
}
