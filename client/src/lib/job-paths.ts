/** Client URLs of the job screens (config/paths.ts holds the app's top-level ones). */
export const jobPaths = {
  list: '/jobs',
  new: '/jobs/new',
  walkthrough: (jobId: string) => `/jobs/${encodeURIComponent(jobId)}`,
  loads: (jobId: string) => `/jobs/${encodeURIComponent(jobId)}/loads`,
  print: (jobId: string) => `/jobs/${encodeURIComponent(jobId)}/loads/print`,
} as const;

/** Route patterns for the router, in step with jobPaths. */
export const jobRoutePatterns = {
  list: '/jobs',
  new: '/jobs/new',
  walkthrough: '/jobs/:jobId',
  loads: '/jobs/:jobId/loads',
  print: '/jobs/:jobId/loads/print',
} as const;
