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
    handler: async ({ em, actor, query }) => {
      const { items, total } = await listJobViews(em, actor, query);
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
    handler: async ({ em, actor, params }) => ({ job: presentJob(await findJobView(em, actor, params.id)) }),
  });
  api.route({
    method: 'post',
    path: '/',
    policy: JOB_EDITORS,
    body: createJobSchema,
    status: 201,
    response: jobResponse,
    versioned: etag,
    handler: async ({ em, actor, body, services }) => ({
      job: presentJob(await createJob(em, actor, services.clock, body)),
    }),
  });
  api.route({
    method: 'patch',
    path: '/:id',
    policy: JOB_EDITORS,
    params: jobIdParams,
    body: updateJobSchema,
    response: jobResponse,
    versioned: etag,
    handler: async ({ em, actor, params, body, services, ifMatch }) => ({
      job: presentJob(await updateJob(em, actor, services.clock, params.id, ifMatch, body)),
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
    handler: async ({ em, actor, params, services, ifMatch }) => {
      await deleteJob(em, actor, services.storage, params.id, ifMatch);
    },
  });
}
