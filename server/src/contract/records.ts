import { z } from 'zod';
import { enteredDesignSchema } from './design-conditions';
import { DESIGN_VALUE_SOURCES, JOB_STATUSES, ROLES, TIGHTNESS, UNIT_SYSTEMS } from './enums';

/**
 * The response schemas: the only shapes records leave the server in. Each server presenter returns the
 * type inferred here (so it cannot drift), the client parses each response with the same schema, and the
 * route declarations name them so the OpenAPI document and the server tests' response check use them too.
 * Objects are not strict: a client one version behind ignores a field added later instead of failing.
 */

const id = z.string();
const timestamp = z.string().describe('ISO 8601 date-time');
/** The id and time fields, for the records kept apart in records-office.ts. */
export { id as recordId, timestamp as recordTimestamp };

export const personRef = z.object({ id, name: z.string() });

/**
 * Who made a record's latest change and on which device (the opaque label that browser made for itself),
 * when the server knows: null for a record last changed before it kept this, or by the demo seed. The time
 * is the record's `updatedAt`. A conflict panel says "Changed on another device at 14:32 by …" from it.
 */
export const lastChangeRecord = z.object({ byName: z.string().nullable(), device: z.string().nullable() });
export type LastChangeRecord = z.output<typeof lastChangeRecord>;

/**
 * Design conditions as a job or the company settings hold them: the numbers calc resolved, read back without
 * calc's bounds (calc checks them where they are used), so a stored value calc now refuses still shows up.
 */
export const storedDesignConditions = z.looseObject(enteredDesignSchema.shape);
export const designSourceRecord = z.object({ source: z.enum(DESIGN_VALUE_SOURCES), note: z.string() });

export const customerRecord = z.object({
  id,
  name: z.string(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
  notes: z.string(),
  /** Optimistic lock, sent back as If-Match on every change. */
  version: z.number().int(),
  createdAt: timestamp,
  updatedAt: timestamp,
  lastChange: lastChangeRecord.nullable().optional(),
});
export type CustomerRecord = z.output<typeof customerRecord>;

export const jobRecord = z.object({
  id,
  status: z.enum(JOB_STATUSES),
  customer: personRef,
  site: z.object({
    street: z.string(),
    unit: z.string(),
    city: z.string(),
    region: z.string(),
    postalCode: z.string(),
  }),
  salesperson: personRef.nullable(),
  assignedInstaller: personRef.nullable(),
  notes: z.string(),
  designConditions: storedDesignConditions.nullable(),
  designSources: z.record(z.string(), designSourceRecord),
  tightness: z.enum(TIGHTNESS),
  /** Bedrooms, blower-door CFM50, ventilation (calc's houseSchema; read back without its bounds, checked where used). */
  house: z.record(z.string(), z.unknown()).optional(),
  version: z.number().int(),
  createdAt: timestamp,
  updatedAt: timestamp,
  lastActivityAt: timestamp,
  lastChange: lastChangeRecord.nullable().optional(),
  /** When the office marked the job ready to propose (the desk's mark; a later change to an option takes it off); null if not marked. */
  readyToProposeAt: timestamp.nullable().optional(),
  /** Whether a proposal version has been issued for the job (the status machine's JobFacts.hasProposal). */
  hasProposal: z.boolean(),
  /** Why the job was lost (the company's list, or "Cancelled by buyer"); null unless it is lost. */
  lostReason: z.string().nullable(),
});
export type JobRecord = z.output<typeof jobRecord>;

export const photoRecord = z.object({
  id,
  roomId: id,
  url: z.string(),
  contentType: z.string(),
  byteSize: z.number(),
  width: z.number(),
  height: z.number(),
  originalName: z.string(),
  createdAt: timestamp,
});
export type PhotoRecord = z.output<typeof photoRecord>;

/** The room input is calc's RoomInput as saved; calc's roomInputSchema checks it where it is used. */
export const roomRecord = z.object({
  id,
  jobId: id,
  position: z.number().int(),
  input: z.record(z.string(), z.unknown()),
  version: z.number().int(),
  createdAt: timestamp,
  updatedAt: timestamp,
  lastChange: lastChangeRecord.nullable().optional(),
  photos: z.array(photoRecord),
});
export type RoomRecord = z.output<typeof roomRecord>;

export const companySettingsRecord = z.object({
  unitSystem: z.enum(UNIT_SYSTEMS),
  defaultDesignConditions: storedDesignConditions.nullable(),
  /** 0 until the owner first saves; send it back as If-Match: "0". */
  version: z.number().int(),
  updatedAt: timestamp.nullable(),
  designConditionsNotice: z.string().optional(),
});
export type CompanySettingsRecord = z.output<typeof companySettingsRecord>;

export const userRecord = z.object({
  id,
  name: z.string(),
  email: z.string(),
  role: z.enum(ROLES),
  active: z.boolean(),
  companyId: id,
  createdAt: timestamp,
});
export type UserRecord = z.output<typeof userRecord>;

export const companyRecord = z.object({ id, name: z.string(), unitSystem: z.enum(UNIT_SYSTEMS) });
export type CompanyRecord = z.output<typeof companyRecord>;

export const staffMember = z.object({ id, name: z.string(), role: z.enum(ROLES) });
export type StaffMember = z.output<typeof staffMember>;

export const outboxMessage = z.object({
  id,
  receivedAt: timestamp,
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string().nullable(),
});
export type OutboxMessage = z.output<typeof outboxMessage>;

/** One page of a list. */
export const pageOf = <T extends z.ZodType>(item: T) =>
  z.object({ items: z.array(item), total: z.number().int(), page: z.number().int(), pageSize: z.number().int() });

/** The bodies of the API's answers, by what they carry. */
export const csrfResponse = z.object({ token: z.string().min(1) });
export const meResponse = z.object({ user: userRecord, company: companyRecord });
export type MeResponse = z.output<typeof meResponse>;
/** GET /api/auth/session: who is signed in, or null; signed out is an answer, not an error (no 401 in the console). */
export const sessionResponse = z.object({ me: meResponse.nullable() });
export const userResponse = z.object({ user: userRecord });
export const usersResponse = z.object({ users: z.array(userRecord) });
export const staffResponse = z.object({ staff: z.array(staffMember) });
export const customerResponse = z.object({ customer: customerRecord });
export const customersResponse = pageOf(customerRecord);
export const jobResponse = z.object({ job: jobRecord });
export const jobsResponse = pageOf(jobRecord);
export const roomResponse = z.object({ room: roomRecord });
export const roomsResponse = z.object({ rooms: z.array(roomRecord) });
export const photoResponse = z.object({ photo: photoRecord });
export const settingsResponse = z.object({ settings: companySettingsRecord });
export const outboxResponse = z.object({ messages: z.array(outboxMessage) });
export const healthResponse = z.object({ status: z.enum(['ok', 'degraded']), db: z.enum(['ok', 'down']) });

/** RFC 9457 problem details, as every error leaves the server (`application/problem+json`). */
export const problemRecord = z.looseObject({
  type: z.string(),
  title: z.string(),
  status: z.number().int(),
  detail: z.string().optional(),
  instance: z.string().optional(),
  errors: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
});
export type ProblemRecord = z.output<typeof problemRecord>;
