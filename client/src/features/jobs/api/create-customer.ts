import { apiFetch } from '../../../lib/api-client';
import { customerResponse } from '@contract';

export interface CreateCustomerBody {
  name: string;
  email?: string | null;
  phone?: string | null;
  notes?: string;
}

/** POST /api/customers. */
export async function createCustomer(body: CreateCustomerBody) {
  return (await apiFetch('/api/customers', { method: 'POST', body, schema: customerResponse })).customer;
}
