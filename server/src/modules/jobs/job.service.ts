import { isDeepStrictEqual } from 'node:util';
import {
  enteredOf,
  INSTALLER_ROLES,
  JOB_OWNER_ROLES,
  mayAssignInstaller,
  mayChooseSalesperson,
  mayMoveJob,
  isListedReason,
  NEEDS_PROPOSAL_MESSAGE,
  roleMayMoveJob,
  nextStatuses,
  notesOf,
  type JobStatus,
} from '@contract';
import { ForbiddenError, UnprocessableError, ValidationError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import { CompanySchema } from '../companies/company.entity';
import { companyDesignDefaults } from '../company-settings/company-settings.service';
import { CustomerSchema, type Customer } from '../customers/customer.entity';
import { UserSchema, type User } from '../users/user.entity';
import { resolveDesignConditions } from './design-conditions';
import { findJob } from './job-access';
import { JobSchema } from './job.entity';
import { jobViewOf, presentJob, type JobView } from './job.presenter';
import { jobHasProposal, recordMarkedLost } from './job-moves';
import { lossReasonsOf } from './loss-reasons.service';
import type { CreateJobInput, UpdateJobInput } from './job.schema';
import { assertVersion } from '../../lib/version-lock';
import { stampOf } from '../../lib/change-stamp';

async function customerOf({ em, actor }: ServiceContext, id: string): Promise<Customer> {
  const c = await em.findOne(CustomerSchema, { id, company: actor.companyId });
  if (!c) throw new ValidationError([{ path: 'customerId', message: 'Choose a customer of your company.' }]);
  return c;
}

async function salespersonOf({ em, actor }: ServiceContext, id: string | undefined): Promise<User> {
  const wanted = id ?? actor.userId;
  if (!mayChooseSalesperson({ id: actor.userId, role: actor.role }, wanted))
    throw new ForbiddenError('A salesperson can only own their own jobs.');
  const u = await em.findOne(UserSchema, {
    id: wanted,
    company: actor.companyId,
    active: true,
    role: { $in: [...JOB_OWNER_ROLES] },
  });
  if (!u)
    throw new ValidationError([
      { path: 'salespersonId', message: 'Choose an active salesperson, estimator or owner of your company.' },
    ]);
  return u;
}

async function installerOf({ em, actor }: ServiceContext, id: string | null): Promise<User | null> {
  if (!mayAssignInstaller(actor.role)) throw new ForbiddenError('Only an owner or estimator assigns installers.');
  if (id === null) return null;
  const u = await em.findOne(UserSchema, {
    id,
    company: actor.companyId,
    active: true,
    role: { $in: [...INSTALLER_ROLES] },
  });
  if (!u)
    throw new ValidationError([
      { path: 'assignedInstallerId', message: 'Choose an active installer of your company.' },
    ]);
  return u;
}

export async function createJob(ctx: ServiceContext, input: CreateJobInput): Promise<JobView> {
  const { em, actor, clock } = ctx;
  const customer = await customerOf(ctx, input.customerId);
  const salesperson = await salespersonOf(ctx, input.salespersonId);
  const installer = input.assignedInstallerId === undefined ? null : await installerOf(ctx, input.assignedInstallerId);
  const defaults = await companyDesignDefaults(em, actor.companyId);
  const design =
    input.designConditions || defaults
      ? resolveDesignConditions(input.designConditions ?? {}, input.designSourceNotes ?? {}, defaults)
      : null;
  const now = clock.now();
  const job = em.create(JobSchema, {
    company: em.getReference(CompanySchema, actor.companyId),
    customer,
    salesperson,
    assignedInstaller: installer,
    status: 'walkthrough',
    street: input.street,
    unit: input.unit ?? '',
    city: input.city,
    region: input.region,
    postalCode: input.postalCode,
    notes: input.notes ?? '',
    designConditions: design?.conditions ?? null,
    designSources: design?.sources ?? {},
    tightness: input.tightness ?? 'average',
    house: input.house ?? {},
    lastActivityAt: now,
    ...stampOf(actor),
  });
  await em.flush();
  return jobViewOf(job, { hasProposal: false });
}

const LOST_REASON_NEEDED = 'Choose why the job was lost, from the company’s list of reasons.';

/** The list's own spelling of the reason chosen, or a 422 when it is not on the company's list. */
async function listedReason(ctx: ServiceContext, reason: string | undefined): Promise<string> {
  if (reason === undefined)
    throw new UnprocessableError(LOST_REASON_NEEDED, { errors: [{ path: 'lostReason', message: LOST_REASON_NEEDED }] });
  const { reasons } = await lossReasonsOf(ctx.em, ctx.actor.companyId);
  const listed = reasons.find((r) => isListedReason([r], reason));
  if (!listed)
    throw new UnprocessableError(`“${reason}” is not one of the company’s loss reasons.`, {
      errors: [{ path: 'lostReason', message: `Choose one of: ${reasons.join('; ')}.` }],
    });
  return listed;
}

export async function updateJob(
  ctx: ServiceContext,
  id: string,
  version: number,
  input: UpdateJobInput,
): Promise<JobView> {
  const { em, actor, clock } = ctx;
  const job = await findJob(ctx, id);
  const facts = { hasProposal: await jobHasProposal(em, actor.companyId, job.id) };
  assertVersion(version, job.version, 'The job', () => presentJob(jobViewOf(job, facts)));
  const from: JobStatus = job.status;
  const to: JobStatus = input.status ?? from;
  if (input.lostReason !== undefined && to !== 'lost')
    throw new UnprocessableError('A loss reason is given only when the job is marked lost.', {
      errors: [{ path: 'lostReason', message: 'A loss reason is given only when the job is marked lost.' }],
    });
  if (input.status !== undefined && input.status !== from) {
    const allowed = nextStatuses(from);
    if (!allowed.includes(input.status)) {
      throw new UnprocessableError(`A job cannot move from ${from} to ${input.status}.`, {
        errors: [{ path: 'status', message: `Allowed next states: ${allowed.join(', ') || 'none'}.` }],
      });
    }
    if (!roleMayMoveJob(actor.role, from, input.status))
      throw new ForbiddenError(`Your role cannot move a job from ${from} to ${input.status}.`);
    if (!mayMoveJob(actor.role, from, input.status, facts))
      throw new UnprocessableError(NEEDS_PROPOSAL_MESSAGE, {
        errors: [{ path: 'status', message: NEEDS_PROPOSAL_MESSAGE }],
      });
    if (input.status === 'lost') {
      // Marked lost by hand: the reason from the company's list, and the proposal's audit trail says so.
      job.lostReason = await listedReason(ctx, input.lostReason);
      await recordMarkedLost(em, {
        companyId: actor.companyId,
        jobId: job.id,
        reason: job.lostReason,
        from,
        byUserId: actor.userId,
        at: clock.now(),
      });
    } else job.lostReason = null;
    job.status = input.status;
  } else if (input.lostReason !== undefined) {
    // A lost job's reason corrected (from the list); the trail is not written again.
    job.lostReason = await listedReason(ctx, input.lostReason);
  }
  if (input.customerId !== undefined) job.customer = await customerOf(ctx, input.customerId);
  if (input.salespersonId !== undefined) job.salesperson = await salespersonOf(ctx, input.salespersonId);
  if (input.assignedInstallerId !== undefined)
    job.assignedInstaller = await installerOf(ctx, input.assignedInstallerId);
  if (input.street !== undefined) job.street = input.street;
  if (input.unit !== undefined) job.unit = input.unit;
  if (input.city !== undefined) job.city = input.city;
  if (input.region !== undefined) job.region = input.region;
  if (input.postalCode !== undefined) job.postalCode = input.postalCode;
  if (input.notes !== undefined) job.notes = input.notes;
  const loadsBefore = { tightness: job.tightness, house: job.house, design: job.designConditions ?? null };
  if (input.tightness !== undefined) job.tightness = input.tightness;
  if (input.house !== undefined) job.house = input.house;
  if (input.designConditions !== undefined || input.designSourceNotes !== undefined) {
    const entered = input.designConditions ?? enteredOf(job.designConditions ?? null, job.designSources);
    const notes = input.designSourceNotes ?? notesOf(job.designSources);
    const design = resolveDesignConditions(entered, notes, await companyDesignDefaults(em, actor.companyId));
    job.designConditions = design.conditions;
    job.designSources = design.sources;
  }
  // The home's facts or design conditions changed: the loads the office reviewed are not the loads now,
  // so the "ready to propose" mark goes (as with a room change; see touchJobLoads).
  const loadsAfter = { tightness: job.tightness, house: job.house, design: job.designConditions ?? null };
  if (!isDeepStrictEqual(loadsBefore, loadsAfter)) {
    job.readyAt = null;
    job.readyBy = null;
    job.readyOverride = null;
  }
  job.lastActivityAt = clock.now();
  Object.assign(job, stampOf(actor));
  await em.flush();
  return jobViewOf(job, facts);
}
