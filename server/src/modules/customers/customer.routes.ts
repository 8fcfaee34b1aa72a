import { customerResponse, customersResponse } from '@contract';
import { JOB_EDITORS, NO_CONTENT, OFFICE, type ApiRouter } from '../../lib/route';
import { presentCustomer } from './customer.presenter';
import { createCustomerSchema, customerIdParams, listCustomersQuery, updateCustomerSchema } from './customer.schema';
import { createCustomer, deleteCustomer, getCustomer, listCustomers, updateCustomer } from './customer.service';

const etag = (out: { customer: { version: number } }) => out.customer.version;

/** Installers meet customers only through the jobs assigned to them. */
export function customerRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/',
    policy: JOB_EDITORS,
    query: listCustomersQuery,
    response: customersResponse,
    handler: async ({ service, query }) => {
      const { items, total } = await listCustomers(service, query);
      return { items: items.map(presentCustomer), total, page: query.page, pageSize: query.pageSize };
    },
  });
  api.route({
    method: 'get',
    path: '/:id',
    policy: JOB_EDITORS,
    params: customerIdParams,
    response: customerResponse,
    versioned: etag,
    handler: async ({ service, params }) => ({ customer: presentCustomer(await getCustomer(service, params.id)) }),
  });
  api.route({
    method: 'post',
    path: '/',
    policy: JOB_EDITORS,
    body: createCustomerSchema,
    status: 201,
    response: customerResponse,
    versioned: etag,
    handler: async ({ service, body }) => ({ customer: presentCustomer(await createCustomer(service, body)) }),
  });
  api.route({
    method: 'patch',
    path: '/:id',
    policy: JOB_EDITORS,
    params: customerIdParams,
    body: updateCustomerSchema,
    response: customerResponse,
    versioned: etag,
    handler: async ({ service, params, body, ifMatch }) => ({
      customer: presentCustomer(await updateCustomer(service, params.id, ifMatch, body)),
    }),
  });
  api.route({
    method: 'delete',
    path: '/:id',
    policy: OFFICE,
    params: customerIdParams,
    response: NO_CONTENT,
    versioned: true,
    handler: async ({ service, params, ifMatch }) => {
      await deleteCustomer(service, params.id, ifMatch);
    },
  });
}
