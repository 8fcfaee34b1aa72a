import { jobResponse, jobsResponse } from '@contract';
import { ANY_STAFF, JOB_EDITORS, NO_CONTENT, type ApiRouter } from '../../lib/route';
import { deleteJob } from './job-delete';
import { findJobView, listJobViews } from './job-reads';
import { presentJob } from './job.presenter';
import { createJobSchema, jobIdParams, listJobsQuery, updateJobSchema } from './job.schema';
import { createJob, updateJob } from './job.service';

const etag = (out: { job: { version: number } }) => out.job.version;

export function jobRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/',
    policy: ANY_STAFF,
    summary: 'The jobs the person may see, newest activity first',
    query: listJobsQuery,
    response: jobsResponse,
    handler: async ({ service, query }) => {
      const { items, total } = await listJobViews(service, query);
      return { items: items.map(presentJob), total, page: query.page, pageSize: query.pageSize };
    },
  });
  api.route({
    method: 'get',
    path: '/:id',
    policy: ANY_STAFF,
    params: jobIdParams,
    response: jobResponse,
    versioned: etag,
    handler: async ({ service, params }) => ({ job: presentJob(await findJobView(service, params.id)) }),
  });
  api.route({
    method: 'post',
    path: '/',
    policy: JOB_EDITORS,
    body: createJobSchema,
    status: 201,
    response: jobResponse,
    versioned: etag,
    handler: async ({ service, body }) => ({ job: presentJob(await createJob(service, body)) }),
  });
  api.route({
    method: 'patch',
    path: '/:id',
    policy: JOB_EDITORS,
    params: jobIdParams,
    body: updateJobSchema,
    response: jobResponse,
    versioned: etag,
    handler: async ({ service, params, body, ifMatch }) => ({
      job: presentJob(await updateJob(service, params.id, ifMatch, body)),
    }),
  });
  api.route({
    method: 'delete',
    path: '/:id',
    policy: JOB_EDITORS,
    summary: 'Deletes a job still in walk-through or design, with its rooms and photos',
    params: jobIdParams,
    response: NO_CONTENT,
    versioned: true,
    handler: async ({ service, params, services, ifMatch }) => {
      await deleteJob({ ...service, storage: services.storage }, params.id, ifMatch);
    },
  });
}
