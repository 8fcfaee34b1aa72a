import { JOB_EDITORS, OFFICE, type ApiRouter } from '../../lib/route';
import { presentCustomer } from './customer.presenter';
import { createCustomerSchema, customerIdParams, listCustomersQuery, updateCustomerSchema } from './customer.schema';
import { createCustomer, deleteCustomer, getCustomer, listCustomers, updateCustomer } from './customer.service';

/** Installers meet customers only through the jobs assigned to them. */

export function customerRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/',
    policy: JOB_EDITORS,
    query: listCustomersQuery,
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
    handler: async ({ em, actor, params }) => ({ customer: presentCustomer(await getCustomer(em, actor, params.id)) }),
  });
  api.route({
    method: 'post',
    path: '/',
    policy: JOB_EDITORS,
    body: createCustomerSchema,
    status: 201,
    handler: async ({ em, actor, body }) => ({ customer: presentCustomer(await createCustomer(em, actor, body)) }),
  });
  api.route({
    method: 'patch',
    path: '/:id',
    policy: JOB_EDITORS,
    params: customerIdParams,
    body: updateCustomerSchema,
    handler: async ({ em, actor, params, body }) => ({
      customer: presentCustomer(await updateCustomer(em, actor, params.id, body)),
    }),
  });
  api.route({
    method: 'delete',
    path: '/:id',
    policy: OFFICE,
    params: customerIdParams,
    handler: async ({ em, actor, params, res }) => {
      await deleteCustomer(em, actor, params.id);
      res.status(204).end();
      return undefined;
    },
  });
}
