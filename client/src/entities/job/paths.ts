/** Client URLs of the job screens (config/paths.ts holds the app's top-level ones). */
export const jobPaths = {
  list: '/jobs',
  new: '/jobs/new',
  walkthrough: (jobId: string) => `/jobs/${encodeURIComponent(jobId)}`,
  loads: (jobId: string) => `/jobs/${encodeURIComponent(jobId)}/loads`,
  print: (jobId: string) => `/jobs/${encodeURIComponent(jobId)}/loads/print`,
  desk: (jobId: string) => `/jobs/${encodeURIComponent(jobId)}/desk`,
  proposal: (jobId: string) => `/jobs/${encodeURIComponent(jobId)}/proposal`,
  commissioning: (jobId: string) => `/jobs/${encodeURIComponent(jobId)}/commissioning`,
  packet: (jobId: string) => `/jobs/${encodeURIComponent(jobId)}/packet`,
} as const;

/** Route patterns for the router, in step with jobPaths. */
export const jobRoutePatterns = {
  list: '/jobs',
  new: '/jobs/new',
  walkthrough: '/jobs/:jobId',
  loads: '/jobs/:jobId/loads',
  print: '/jobs/:jobId/loads/print',
  desk: '/jobs/:jobId/desk',
  proposal: '/jobs/:jobId/proposal',
  commissioning: '/jobs/:jobId/commissioning',
  packet: '/jobs/:jobId/packet',
} as const;

/** The API's addresses for a job and the records hanging off it. */
export const jobPath = (jobId: string) => `/api/jobs/${encodeURIComponent(jobId)}`;
export const roomsPath = (jobId: string) => `${jobPath(jobId)}/rooms`;
export const roomPath = (jobId: string, roomId: string) => `${roomsPath(jobId)}/${encodeURIComponent(roomId)}`;
export const customerPath = (customerId: string) => `/api/customers/${encodeURIComponent(customerId)}`;
export const STAFF_PATH = '/api/staff';
export const COMPANY_SETTINGS_PATH = '/api/company/settings';
export const LOSS_REASONS_PATH = '/api/company/loss-reasons';
