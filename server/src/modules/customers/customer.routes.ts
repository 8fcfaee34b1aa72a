import { JOB_EDITORS, OFFICE, type ApiRouter } from '../../lib/route';
import { ifMatchVersion, setEtag } from '../jobs/version-lock';
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
    handler: async ({ em, actor, params, res }) => {
      const customer = await getCustomer(em, actor, params.id);
      setEtag(res, customer.version);
      return { customer: presentCustomer(customer) };
    },
  });
  api.route({
    method: 'post',
    path: '/',
    policy: JOB_EDITORS,
    body: createCustomerSchema,
    status: 201,
    handler: async ({ em, actor, body, res }) => {
      const customer = await createCustomer(em, actor, body);
      setEtag(res, customer.version);
      return { customer: presentCustomer(customer) };
    },
  });
  api.route({
    method: 'patch',
    path: '/:id',
    policy: JOB_EDITORS,
    params: customerIdParams,
    body: updateCustomerSchema,
    handler: async ({ em, actor, params, body, req, res }) => {
      const customer = await updateCustomer(em, actor, params.id, ifMatchVersion(req), body);
      setEtag(res, customer.version);
      return { customer: presentCustomer(customer) };
    },
  });
  api.route({
    method: 'delete',
    path: '/:id',
    policy: OFFICE,
    params: customerIdParams,
    handler: async ({ em, actor, params, req, res }) => {
      await deleteCustomer(em, actor, params.id, ifMatchVersion(req));
      res.status(204).end();
      return undefined;
    },
  });
}
