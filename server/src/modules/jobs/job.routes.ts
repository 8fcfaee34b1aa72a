import { ANY_STAFF, JOB_EDITORS, type ApiRouter } from '../../lib/route';
import { deleteJob } from './job-delete';
import { findJobView, listJobViews } from './job-reads';
import { presentJob } from './job.presenter';
import { createJobSchema, jobIdParams, listJobsQuery, updateJobSchema } from './job.schema';
import { createJob, updateJob } from './job.service';
import { ifMatchVersion, setEtag } from './version-lock';

export function jobRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/',
    policy: ANY_STAFF,
    query: listJobsQuery,
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
    handler: async ({ em, actor, params, res }) => {
      const job = await findJobView(em, actor, params.id);
      setEtag(res, job.version);
      return { job: presentJob(job) };
    },
  });
  api.route({
    method: 'post',
    path: '/',
    policy: JOB_EDITORS,
    body: createJobSchema,
    status: 201,
    handler: async ({ em, actor, body, services, res }) => {
      const job = await createJob(em, actor, services.clock, body);
      setEtag(res, job.version);
      return { job: presentJob(job) };
    },
  });
  api.route({
    method: 'patch',
    path: '/:id',
    policy: JOB_EDITORS,
    params: jobIdParams,
    body: updateJobSchema,
    handler: async ({ em, actor, params, body, services, req, res }) => {
      const job = await updateJob(em, actor, services.clock, params.id, ifMatchVersion(req), body);
      setEtag(res, job.version);
      return { job: presentJob(job) };
    },
  });
  api.route({
    method: 'delete',
    path: '/:id',
    policy: JOB_EDITORS,
    params: jobIdParams,
    handler: async ({ em, actor, params, services, req, res }) => {
      await deleteJob(em, actor, services.storage, params.id, ifMatchVersion(req));
      res.status(204).end();
      return undefined;
    },
  });
}
