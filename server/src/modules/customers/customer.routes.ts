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
    handler: async ({ em, actor, query }) => {
      const { items, total } = await listCustomers(em, actor, query);
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
    handler: async ({ em, actor, params }) => ({ customer: presentCustomer(await getCustomer(em, actor, params.id)) }),
  });
  api.route({
    method: 'post',
    path: '/',
    policy: JOB_EDITORS,
    body: createCustomerSchema,
    status: 201,
    response: customerResponse,
    versioned: etag,
    handler: async ({ em, actor, body }) => ({ customer: presentCustomer(await createCustomer(em, actor, body)) }),
  });
  api.route({
    method: 'patch',
    path: '/:id',
    policy: JOB_EDITORS,
    params: customerIdParams,
    body: updateCustomerSchema,
    response: customerResponse,
    versioned: etag,
    handler: async ({ em, actor, params, body, ifMatch }) => ({
      customer: presentCustomer(await updateCustomer(em, actor, params.id, ifMatch, body)),
    }),
  });
  api.route({
    method: 'delete',
    path: '/:id',
    policy: OFFICE,
    params: customerIdParams,
    response: NO_CONTENT,
    versioned: true,
    handler: async ({ em, actor, params, ifMatch }) => {
      await deleteCustomer(em, actor, params.id, ifMatch);
    },
  });
}
