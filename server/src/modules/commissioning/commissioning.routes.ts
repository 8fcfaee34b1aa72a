import { z } from 'zod';
import {
  COMMISSIONING_ROLES,
  amendmentInput,
  certificationInput,
  commissioningPatch,
  commissioningResponse,
  commissioningSignOffInput,
  evacuationPolicyInput,
  evacuationPolicyRecord,
  refrigerantEntryInput,
} from '@contract';
import { ANY_STAFF, OWNER, roles, type ApiRouter } from '../../lib/route';
import {
  addAmendment,
  addRefrigerant,
  certNumberOf,
  patchOrConflict,
  policyOf,
  putPolicy,
  readRecord,
  setCertNumber,
  signOff,
} from './commissioning.service';

const COMMISSIONING = roles(...COMMISSIONING_ROLES);
const jobParams = z.object({ jobId: z.uuid({ message: 'Must be a job id.' }) });

/** The job's commissioning record, under /api/jobs (installers: assigned jobs only; another company's: 404). */
export function commissioningRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/:jobId/commissioning',
    policy: COMMISSIONING,
    summary: 'The commissioning record with calc’s verdicts beside each step (made empty on the first read)',
    params: jobParams,
    response: commissioningResponse,
    versioned: (out) => out.record.version,
    handler: async ({ service, params }) => ({ record: await readRecord(service, params.jobId) }),
  });
  api.route({
    method: 'patch',
    path: '/:jobId/commissioning',
    policy: COMMISSIONING,
    summary: 'Saves one or more steps as entered (If-Match; a stale version is a 409 with both sides)',
    params: jobParams,
    body: commissioningPatch,
    response: commissioningResponse,
    versioned: (out) => out.record.version,
    handler: async ({ service, params, body, ifMatch }) => ({
      record: await patchOrConflict(service, params.jobId, ifMatch, body),
    }),
  });
  api.route({
    method: 'post',
    path: '/:jobId/commissioning/refrigerant',
    policy: COMMISSIONING,
    summary: 'One weighing of refrigerant added or recovered (the id made on the device; a replay is no second entry)',
    params: jobParams,
    body: refrigerantEntryInput,
    status: 201,
    response: commissioningResponse,
    versioned: (out) => out.record.version,
    handler: async ({ service, params, body }) => ({ record: await addRefrigerant(service, params.jobId, body) }),
  });
  api.route({
    method: 'post',
    path: '/:jobId/commissioning/sign-off',
    policy: COMMISSIONING,
    summary: 'The installer signs off and the customer acknowledges; the job becomes installed, the record read-only',
    params: jobParams,
    body: commissioningSignOffInput,
    response: commissioningResponse,
    versioned: (out) => out.record.version,
    handler: async ({ service, services, params, body, ifMatch }) => ({
      record: await signOff({ ...service, storage: services.storage }, params.jobId, ifMatch, body),
    }),
  });
  api.route({
    method: 'post',
    path: '/:jobId/commissioning/amendments',
    policy: COMMISSIONING,
    summary: 'A correction to a signed-off record: what, the correction and why (kept with who and when)',
    params: jobParams,
    body: amendmentInput,
    status: 201,
    response: commissioningResponse,
    versioned: (out) => out.record.version,
    handler: async ({ service, params, body }) => ({ record: await addAmendment(service, params.jobId, body) }),
  });
}

const policyResponse = z.object({ policy: evacuationPolicyRecord });
const certResponse = z.object({ certNumber: z.string().nullable() });

/** The owner's evacuation policy, under /api/company. */
export function commissioningPolicyRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/commissioning-policy',
    policy: ANY_STAFF,
    summary: 'The evacuation policy and start-up readings (the UL-derived defaults until the owner saves)',
    response: policyResponse,
    versioned: (out) => out.policy.version,
    handler: async ({ service }) => ({ policy: await policyOf(service.em, service.actor.companyId) }),
  });
  api.route({
    method: 'put',
    path: '/commissioning-policy',
    policy: OWNER,
    summary: 'Sets the evacuation policy (If-Match: the version read, "0" before the first save)',
    body: evacuationPolicyInput,
    response: policyResponse,
    versioned: (out) => out.policy.version,
    handler: async ({ service, body, ifMatch }) => ({ policy: await putPolicy(service, ifMatch, body) }),
  });
}

/** The signed-in person's refrigerant-handling certification number, under /api/me. */
export function certificationRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/refrigerant-certification',
    policy: ANY_STAFF,
    summary: 'Your refrigerant-handling certification number (null: none given)',
    response: certResponse,
    handler: async ({ service }) => ({
      certNumber: await certNumberOf(service.em, service.actor.companyId, service.actor.userId),
    }),
  });
  api.route({
    method: 'put',
    path: '/refrigerant-certification',
    policy: ANY_STAFF,
    summary: 'Sets your refrigerant-handling certification number ("" removes it)',
    body: certificationInput,
    response: certResponse,
    handler: async ({ service, body }) => ({ certNumber: await setCertNumber(service, body.certNumber) }),
  });
}
