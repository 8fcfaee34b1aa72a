import { z } from 'zod';
import {
  createOptionBody,
  DESK_MESSAGES,
  deskResponse,
  readyBody,
  discountDecisionBody,
  firstPriceBody,
  firstPriceResponse,
  suggestBody,
  suggestResponse,
  optionResponse,
  regenerateBody,
  takeoffEditsBody,
  updateOptionBody,
  type DeskResponse,
  type OptionRecord,
  type Role,
} from '@contract';
import { ANY_STAFF, JOB_EDITORS, JsonBytes, NO_CONTENT, OFFICE, OWNER, type ApiRouter } from '../../lib/route';
import { UnprocessableError } from '../../lib/errors';
import { uuidParam } from '../../lib/validate';
import { presentDesk, presentDeskBytes, presentOption } from './desk.presenter';
import { keptOptionBytes } from './desk-read';
import {
  createFirstPrice,
  createOption,
  suggestForJob,
  decideDiscount,
  deleteOption,
  getDesk,
  getOption,
  markReady,
  regenerateTakeoff,
  reviewOption,
  setTakeoffEdits,
  unmarkReady,
  updateOption,
  type OptionView,
} from './desk.service';

const jobParams = z.strictObject({ jobId: uuidParam });
const optionParams = z.strictObject({ jobId: uuidParam, optionId: uuidParam });
const etag = (out: { option: { version: number } }) => out.option.version;

/**
 * The answer to a change of one option: the service gets the role's presenter (a 409 carries the option
 * as it is now, as this person may see it) and the changed option is presented with it.
 */
async function changed(role: Role, change: (present: (v: OptionView) => OptionRecord) => Promise<OptionView>) {
  const present = (v: OptionView) => presentOption(v, role);
  return { option: present(await change(present)) };
}

// Actions on an option (regenerate, discount decision, review) are POSTs that change a versioned row: declared
// `versioned`, they take If-Match like a PATCH (the declaration reads it for every versioned POST but a 201 create).

/** The estimator's desk: a job's priced options, worked out by calc from saved inputs on every answer. */
export function deskRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/:jobId/desk',
    policy: ANY_STAFF,
    summary: "The job's options, each recomputed, and whether the job may be proposed",
    params: jobParams,
    response: deskResponse,
    // The options' JSON is kept while nothing it is made from changes (desk-read.ts keptOptionBytes).
    handler: async ({ service, params, actor }) =>
      new JsonBytes<DeskResponse>(presentDeskBytes(await getDesk(service, params.jobId), actor.role, keptOptionBytes)),
  });
  api.route({
    method: 'post',
    path: '/:jobId/options',
    policy: JOB_EDITORS,
    summary: 'A new option (at most three per job), empty, with inputs, or a copy of another option',
    params: jobParams,
    body: createOptionBody,
    status: 201,
    response: optionResponse,
    versioned: etag,
    handler: async ({ service, params, body, actor }) => ({
      option: presentOption(await createOption(service, params.jobId, body), actor.role),
    }),
  });
  api.route({
    method: 'get',
    path: '/:jobId/options/:optionId',
    policy: ANY_STAFF,
    params: optionParams,
    response: optionResponse,
    versioned: etag,
    handler: async ({ service, params, actor }) => ({
      option: presentOption(await getOption(service, params.jobId, params.optionId), actor.role),
    }),
  });
  api.route({
    method: 'patch',
    path: '/:jobId/options/:optionId',
    policy: JOB_EDITORS,
    summary: "An option's name, design or pricing inputs; totals are never inputs",
    params: optionParams,
    body: updateOptionBody,
    response: optionResponse,
    versioned: etag,
    handler: async ({ service, params, body, actor, ifMatch }) => {
      return changed(actor.role, (present) =>
        updateOption(service, params.jobId, params.optionId, ifMatch, body, present),
      );
    },
  });
  api.route({
    method: 'delete',
    path: '/:jobId/options/:optionId',
    policy: JOB_EDITORS,
    params: optionParams,
    response: NO_CONTENT,
    versioned: true,
    handler: async ({ service, params, actor, ifMatch }) => {
      await deleteOption(service, params.jobId, params.optionId, ifMatch, (v) => presentOption(v, actor.role));
    },
  });
  api.route({
    method: 'put',
    path: '/:jobId/options/:optionId/takeoff-edits',
    policy: OFFICE,
    summary: "The option's takeoff edits (changed, added and removed lines); the generated values are kept beside them",
    params: optionParams,
    body: takeoffEditsBody,
    response: optionResponse,
    versioned: etag,
    handler: async ({ service, params, body, actor, ifMatch }) => {
      return changed(actor.role, (present) =>
        setTakeoffEdits(service, params.jobId, params.optionId, ifMatch, body.edits, present),
      );
    },
  });
  api.route({
    method: 'post',
    path: '/:jobId/options/:optionId/takeoff/regenerate',
    policy: OFFICE,
    summary: 'Regenerates the takeoff: keeps the edits that still apply; accepts or drops those that no longer do',
    params: optionParams,
    body: regenerateBody,
    response: optionResponse,
    versioned: etag,
    handler: async ({ service, params, body, actor, ifMatch }) => {
      return changed(actor.role, (present) =>
        regenerateTakeoff(service, params.jobId, params.optionId, ifMatch, body, present),
      );
    },
  });
  api.route({
    method: 'post',
    path: '/:jobId/options/:optionId/discount-decision',
    policy: OWNER,
    summary: "The owner approves or denies a discount beyond someone's limit",
    params: optionParams,
    body: discountDecisionBody,
    response: optionResponse,
    versioned: etag,
    handler: async ({ service, params, body, actor, ifMatch }) => {
      return changed(actor.role, (present) =>
        decideDiscount(service, params.jobId, params.optionId, ifMatch, body.approve, present),
      );
    },
  });
  api.route({
    method: 'post',
    path: '/:jobId/options/:optionId/review',
    policy: OFFICE,
    summary: 'The office has reviewed a first price: the option may be proposed',
    params: optionParams,
    response: optionResponse,
    versioned: etag,
    handler: async ({ service, params, actor, ifMatch }) => {
      return changed(actor.role, (present) => reviewOption(service, params.jobId, params.optionId, ifMatch, present));
    },
  });
  api.route({
    method: 'post',
    path: '/:jobId/suggest',
    policy: JOB_EDITORS,
    summary: "calc's suggestion from the active catalog (zones, indoor and outdoor units, with why); nothing is stored",
    params: jobParams,
    body: suggestBody,
    response: suggestResponse,
    handler: async ({ service, params, body }) => {
      const s = await suggestForJob(service, params.jobId, body);
      return { design: { ...s.design }, reasons: s.reasons.map((r) => ({ ...r })), warnings: [...s.warnings] };
    },
  });
  api.route({
    method: 'post',
    path: '/:jobId/first-price',
    policy: JOB_EDITORS,
    summary: 'A first price after the walk-through: one preliminary option from the suggestion, with its range',
    params: jobParams,
    body: firstPriceBody,
    status: 201,
    response: firstPriceResponse,
    handler: async ({ service, params, body, actor }) => {
      const option = presentOption(
        await createFirstPrice(service, params.jobId, body.name ?? 'First price'),
        actor.role,
      );
      const range = option.result?.preliminaryRange;
      if (!range) throw new UnprocessableError('The first price could not be worked out.', { errors: option.problems });
      return { option, range, preliminary: true as const, notice: DESK_MESSAGES.firstPriceNotice };
    },
  });
  api.route({
    method: 'post',
    path: '/:jobId/ready',
    policy: OFFICE,
    summary:
      'Marks the job ready to propose, or answers 422 with every reason it cannot be; units outside their sizing range need sizingOverride.reason',
    params: jobParams,
    body: readyBody,
    response: deskResponse,
    handler: async ({ service, params, actor, body }) =>
      presentDesk(await markReady(service, params.jobId, body), actor.role),
  });
  api.route({
    method: 'delete',
    path: '/:jobId/ready',
    policy: OFFICE,
    summary: 'Takes the ready-to-propose mark off',
    params: jobParams,
    response: deskResponse,
    handler: async ({ service, params, actor }) => presentDesk(await unmarkReady(service, params.jobId), actor.role),
  });
}
