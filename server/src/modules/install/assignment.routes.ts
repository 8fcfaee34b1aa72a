import { z } from 'zod';
import { assignmentsBody, INSTALLER_ROLES, jobAssignmentsResponse, myJobsQuery, myJobsResponse } from '@contract';
import { OFFICE, roles, type ApiRouter } from '../../lib/route';
import { getAssignments, myJobs, putAssignments } from './assignment.service';

const jobParams = z.strictObject({ jobId: z.uuid({ message: 'Must be a job id.' }) });

/** Mounted under /api/jobs: the office schedules a won job's installers. */
export function assignmentRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/:jobId/assignments',
    policy: OFFICE,
    summary: 'The installers scheduled on the job, each with their day',
    params: jobParams,
    response: jobAssignmentsResponse,
    handler: async ({ service, params }) => getAssignments(service, params.jobId),
  });
  api.route({
    method: 'put',
    path: '/:jobId/assignments',
    policy: OFFICE,
    summary: 'Replaces the installers scheduled on a won job (an empty list unschedules it)',
    params: jobParams,
    body: assignmentsBody,
    response: jobAssignmentsResponse,
    handler: async ({ service, params, body }) => putAssignments(service, params.jobId, body),
  });
}

/** Mounted under /api/my-jobs: an installer's day list. */
export function myJobsRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/',
    policy: roles(...INSTALLER_ROLES),
    summary: 'The signed-in installer’s assigned jobs, day by day',
    query: myJobsQuery,
    response: myJobsResponse,
    handler: async ({ service, query }) => myJobs(service, query.from),
  });
}
