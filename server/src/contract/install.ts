import { z } from 'zod';
import { JOB_STATUSES } from './enums';

/**
 * Issue 15 (pack15): scheduling a won job's installers and the installer's job packet. The packet is its
 * own schema, strict all the way down, with no price, cost, margin, discount or deposit field at all: what
 * an installer's answer can hold is decided here, not by what a presenter forgets to drop.
 * Lengths are feet, charge ounces, loads Btu/h, current amperes.
 */

/** A calendar day, 'YYYY-MM-DD' (the site's day; no time, no zone). */
export const isoDay = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Enter a date as YYYY-MM-DD.')
  .refine((s) => {
    const [y, m, d] = s.split('-').map(Number) as [number, number, number];
    const leap = (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
    const days = [31, leap ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][m - 1];
    return days !== undefined && d >= 1 && d <= days;
  }, 'That date does not exist.')
  .refine((s) => s >= '2000-01-01' && s <= '2200-12-31', 'Choose a date between 2000 and 2200.');

/** At most this many installers on one job. */
export const MAX_INSTALLERS_PER_JOB = 8;

/** PUT /api/jobs/:jobId/assignments: the whole set (an empty list unschedules the job). */
export const assignmentsBody = z.strictObject({
  assignments: z
    .array(z.strictObject({ userId: z.uuid({ message: 'Choose an installer.' }), day: isoDay }))
    .max(MAX_INSTALLERS_PER_JOB, `At most ${MAX_INSTALLERS_PER_JOB} installers on one job.`)
    .refine((list) => new Set(list.map((a) => a.userId)).size === list.length, 'Each installer once per job.'),
});
export type AssignmentsBody = z.infer<typeof assignmentsBody>;

export const assignmentRecord = z.object({ userId: z.string(), name: z.string(), day: isoDay });
export type AssignmentRecord = z.infer<typeof assignmentRecord>;

/** GET/PUT /api/jobs/:jobId/assignments. `mayAssign` says whether the job can be scheduled now, and why not. */
export const jobAssignmentsResponse = z.object({
  jobId: z.string(),
  status: z.enum(JOB_STATUSES),
  mayAssign: z.discriminatedUnion('ok', [
    z.object({ ok: z.literal(true) }),
    z.object({ ok: z.literal(false), reason: z.string() }),
  ]),
  assignments: z.array(assignmentRecord),
});
export type JobAssignmentsResponse = z.infer<typeof jobAssignmentsResponse>;

/** Jobs a person may schedule: won (the job is sold) and not yet installed. */
export const SCHEDULABLE_STATUSES = ['won'] as const;

/** One job on an installer's day list: where, for whom, with whom. No money. */
export const myJobRecord = z.strictObject({
  jobId: z.string(),
  status: z.enum(JOB_STATUSES),
  customerName: z.string(),
  street: z.string(),
  unit: z.string(),
  city: z.string(),
  region: z.string(),
  postalCode: z.string(),
  /** The other installers on the same job that day (names). */
  crew: z.array(z.string()),
});
export type MyJobRecord = z.infer<typeof myJobRecord>;

/** GET /api/my-jobs: the signed-in installer's assigned jobs by day, from `from` on (days in order). */
export const myJobsResponse = z.strictObject({
  from: isoDay,
  days: z.array(z.strictObject({ day: isoDay, jobs: z.array(myJobRecord) })),
});
export type MyJobsResponse = z.infer<typeof myJobsResponse>;
export const myJobsQuery = z.strictObject({ from: isoDay.optional() });

const packetModel = z.strictObject({
  /** The model number. */
  model: z.string(),
  name: z.string(),
  kind: z.string(),
  nominalCoolingBtuh: z.number().nullable(),
  nominalHeatingBtuh: z.number().nullable(),
});

const packetPhoto = z.strictObject({ id: z.string(), url: z.string(), width: z.number(), height: z.number() });

/** A room an indoor unit serves: its name from the sold design, with the room's notes and photos as the job holds them now. */
const packetRoom = z.strictObject({
  name: z.string(),
  /** The job's room of that name, or null when it is no longer on the job. */
  roomId: z.string().nullable(),
  notes: z.string(),
  photos: z.array(packetPhoto),
});

const packetLineSet = z.strictObject({
  zoneName: z.string(),
  liquid: z.string(),
  suction: z.string(),
  /** The planned run, ft. */
  plannedLengthFt: z.number(),
  /** The length counted for the charge (a kit's coiled extra included), ft. */
  installedLengthFt: z.number(),
  kind: z.enum(['kit', 'field-cut']),
  liftFt: z.number(),
  extraChargeOz: z.number(),
  /** calc's worked formula, as issued ("65 ft installed − 25 ft pre-charged = 40 ft × 0.16 oz/ft = 6.4 oz"). */
  extraChargeText: z.string(),
  condensate: z.strictObject({ kind: z.enum(['gravity', 'pump']), lengthFt: z.number() }),
});

const packetSystem = z.strictObject({
  name: z.string(),
  refrigerant: z.string(),
  /** The refrigerant is A2L (lower flammability): its handling caution applies. */
  a2l: z.boolean(),
  outdoor: packetModel,
  indoorUnits: z.array(z.strictObject({ zoneName: z.string(), unit: packetModel, rooms: z.array(packetRoom) })),
  lineSets: z.array(packetLineSet),
  extraChargeOz: z.number(),
  /** The system's whole charge: the factory charge plus the extra to weigh in, oz. */
  totalChargeOz: z.number(),
  electrical: z.strictObject({
    supplyVoltage: z.number(),
    mcaA: z.number(),
    mocpA: z.number(),
    breakerA: z.number().nullable(),
    wireAwg: z.number().nullable(),
    circuitLengthFt: z.number(),
    disconnectA: z.number(),
  }),
  heatKit: packetModel.nullable(),
});
export type PacketSystem = z.infer<typeof packetSystem>;

export const PACKET_CAUTION_KEYS = [
  'makerAndCode',
  'refrigerant',
  'pressureTest',
  'a2l',
  'electrical',
  'estimate',
] as const;

/** GET /api/jobs/:jobId/packet: what was sold, for the people who build it. */
export const installPacket = z.strictObject({
  jobId: z.string(),
  status: z.enum(JOB_STATUSES),
  company: z.strictObject({ name: z.string(), phone: z.string().nullable() }),
  customer: z.strictObject({ name: z.string(), phone: z.string().nullable() }),
  site: z.strictObject({
    street: z.string(),
    unit: z.string(),
    city: z.string(),
    region: z.string(),
    postalCode: z.string(),
  }),
  /** The signed version and option it reads. */
  sold: z.strictObject({ versionNumber: z.number().int(), optionName: z.string(), signedAt: z.string() }),
  jobNotes: z.string(),
  systems: z.array(packetSystem),
  /** Over every system, oz. */
  extraChargeOz: z.number(),
  totalChargeOz: z.number(),
  /** The material list (equipment and materials; no labor hours, no prices). */
  materials: z.array(
    z.strictObject({
      description: z.string(),
      quantity: z.number(),
      unit: z.string(),
      category: z.enum(['equipment', 'material']),
    }),
  ),
  cautions: z.array(z.strictObject({ key: z.enum(PACKET_CAUTION_KEYS), title: z.string(), text: z.string() })),
  /** The packet's PDF: its state ('none' before one is asked for) and, once made, its SHA-256. */
  pdf: z.strictObject({
    state: z.enum(['none', 'waiting', 'rendering', 'ready', 'failed']),
    sha256: z.string().nullable(),
  }),
});
export type InstallPacket = z.infer<typeof installPacket>;
