import { z } from 'zod';
import { DESIGN_VALUE_SOURCES, JOB_STATUSES, TIGHTNESS, UNIT_SYSTEMS, type JobStatus } from '@contract';

/**
 * The client's parse boundary for the job records the server presents (job.presenter.ts,
 * room.presenter.ts, photo.presenter.ts, company-settings.presenter.ts). Shared by the jobs,
 * walk-through and loads features, which all read the same records.
 * Room inputs and design conditions stay `unknown`-shaped records here: calc's schemas
 * validate them where they are used, so a stored value calc now rejects still shows up.
 */

export const jobStatusLabels: Record<JobStatus, string> = {
  walkthrough: 'Walk-through',
  design: 'Design',
  proposed: 'Proposed',
  won: 'Won',
  lost: 'Lost',
  installed: 'Installed',
};

/** The words on each status-move button (which moves a person may make is the contract's JOB_STATUS_MACHINE). */
export const moveLabels: Record<JobStatus, string> = {
  walkthrough: 'Back to walk-through',
  design: 'Move to design',
  proposed: 'Mark proposed',
  won: 'Mark won',
  lost: 'Mark lost',
  installed: 'Mark installed',
};

const person = z.object({ id: z.string(), name: z.string() }).nullable();
const designSource = z.object({ source: z.enum(DESIGN_VALUE_SOURCES), note: z.string() });

export const customerRecord = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
  notes: z.string(),
  /** Optimistic lock, sent back as If-Match on every change. */
  version: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type CustomerRecord = z.output<typeof customerRecord>;

export const customerResponse = z.object({ customer: customerRecord });

export const jobRecord = z.object({
  id: z.string(),
  status: z.enum(JOB_STATUSES),
  customer: z.object({ id: z.string(), name: z.string() }),
  site: z.object({
    street: z.string(),
    unit: z.string(),
    city: z.string(),
    region: z.string(),
    postalCode: z.string(),
  }),
  salesperson: person,
  assignedInstaller: person,
  notes: z.string(),
  designConditions: z.record(z.string(), z.unknown()).nullable(),
  designSources: z.record(z.string(), designSource),
  tightness: z.enum(TIGHTNESS),
  version: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
  lastActivityAt: z.string(),
});
export type JobRecord = z.output<typeof jobRecord>;

export const photoRecord = z.object({
  id: z.string(),
  roomId: z.string(),
  url: z.string(),
  contentType: z.string(),
  byteSize: z.number(),
  width: z.number(),
  height: z.number(),
  originalName: z.string(),
  createdAt: z.string(),
});
export type PhotoRecord = z.output<typeof photoRecord>;

export const roomRecord = z.object({
  id: z.string(),
  jobId: z.string(),
  position: z.number().int(),
  input: z.record(z.string(), z.unknown()),
  version: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
  photos: z.array(photoRecord),
});
export type RoomRecord = z.output<typeof roomRecord>;

export const companySettingsRecord = z.object({
  unitSystem: z.enum(UNIT_SYSTEMS),
  defaultDesignConditions: z.record(z.string(), z.unknown()).nullable(),
  version: z.number().int(),
  updatedAt: z.string().nullable(),
  designConditionsNotice: z.string().optional(),
});
export type CompanySettingsRecord = z.output<typeof companySettingsRecord>;

export const jobResponse = z.object({ job: jobRecord });
export const roomResponse = z.object({ room: roomRecord });
export const roomsResponse = z.object({ rooms: z.array(roomRecord) });
export const settingsResponse = z.object({ settings: companySettingsRecord });
