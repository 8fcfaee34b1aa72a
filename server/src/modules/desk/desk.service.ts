import { isDeepStrictEqual } from 'node:util';
import {
  DESK_MESSAGES,
  MAX_OPTIONS,
  PROPOSAL_MESSAGES,
  mayDecideDiscount,
  mayEditTakeoff,
  mayMarkReady,
  mayReviewOption,
  takeoffEditKey,
  addedLineKey,
  optionPricingSchema,
  type BlockerRecord,
  type OptionPricing,
  type TakeoffEditInput,
} from '@contract';
import {
  checkDiscount,
  suggestDesign,
  type CatalogModel,
  type CircuitInput,
  type DesignInput,
  type GivenZone,
  type Suggestion,
} from '@calc';
import { ConflictError, ForbiddenError, NotFoundError, UnprocessableError, ValidationError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import { assertVersion } from '../../lib/version-lock';
import { CompanySchema } from '../companies/company.entity';
import type { Job } from '../jobs/job.entity';
import { liveSignature } from '../proposals/live-signature';
import { UserSchema } from '../users/user.entity';
import { designAsCalcReadsIt } from './desk-design';
import { computeOption, modelKeysOf, type ComputedOption } from './desk-compute';
import {
  compute,
  computeKeyed,
  listOptions,
  readDeskJob,
  readDeskView,
  type DeskJob,
  type DeskJobState,
  type OptionRow,
} from './desk-read';
import { DesignOptionSchema, type DesignOption, type StoredTakeoffEdit } from './option.entity';

export interface OptionView {
  readonly option: OptionRow;
  readonly computed: ComputedOption;
  /** The key its figures are kept by (desk-read.ts computeKeyed). */
  readonly key?: string;
}

/** The desk of a job: its job as a row (GET) or as the entity a write changes (J = Job). */
export interface DeskView<J extends DeskJobState = DeskJobState> {
  readonly desk: DeskJob<J>;
  readonly options: OptionView[];
  readonly blockers: BlockerRecord[];
}

/** Each option worked out, and why the job cannot be proposed yet. */
function viewOf<J extends DeskJobState>(desk: DeskJob<J>, rows: readonly OptionRow[]): DeskView<J> {
  const options = rows.map((option) => ({ option, ...computeKeyed(desk, option) }));
  const blockers: BlockerRecord[] = options.length
    ? options.flatMap((o) => o.computed.blockers)
    : [{ code: 'no-options', optionId: null, message: DESK_MESSAGES.noOptions }];
  return { desk, options, blockers };
}

/** Everything the desk shows for a job (GET …/desk: read by SQL, no entities). */
export async function getDesk(ctx: ServiceContext, jobId: string): Promise<DeskView> {
  const { desk, options } = await readDeskView(ctx, jobId);
  return viewOf(desk, options);
}

/** The desk with the job as an entity, for the ready mark to change. */
async function getDeskToChange(ctx: ServiceContext, jobId: string): Promise<DeskView<Job>> {
  const desk = await readDeskJob(ctx, jobId);
  return viewOf(desk, await listOptions(ctx, desk.job.id));
}

async function findOption(ctx: ServiceContext, desk: DeskJob, optionId: string): Promise<DesignOption> {
  const o = await ctx.em.findOne(
    DesignOptionSchema,
    { id: optionId, job: desk.job.id, company: ctx.actor.companyId },
    { populate: ['createdBy', 'reviewedBy'] },
  );
  if (!o) throw new NotFoundError('The option');
  return o;
}

export async function getOption(ctx: ServiceContext, jobId: string, optionId: string): Promise<OptionView> {
  const desk = await readDeskJob(ctx, jobId);
  const option = await findOption(ctx, desk, optionId);
  return { option, computed: compute(desk, option) };
}

/** A write changes what the office reviewed: the job's "ready to propose" mark goes. */
function touched(ctx: ServiceContext, desk: DeskJob): void {
  if (desk.job.readyAt || desk.job.readyOverride) {
    desk.job.readyAt = null;
    desk.job.readyBy = null;
    desk.job.readyOverride = null;
  }
  desk.job.lastActivityAt = ctx.clock.now();
}

interface OptionIds {
  readonly jobId: string;
  readonly optionId: string;
}

/** Reads the job and the option of a write and checks the version the writer saw (412 with the option as it is now). */
async function lockedOption(
  ctx: ServiceContext,
  ids: OptionIds,
  version: number,
  present: (v: OptionView) => unknown,
): Promise<{ desk: DeskJob; option: DesignOption }> {
  const desk = await readDeskJob(ctx, ids.jobId);
  const option = await findOption(ctx, desk, ids.optionId);
  assertVersion(version, option.version, 'The option', () => present({ option, computed: compute(desk, option) }));
  return { desk, option };
}

/**
 * An approved discount the new price has outgrown waits for the owner again and stops applying
 * (the reason stored with the request, shown on the desk).
 */
function recheckApproval(option: DesignOption, computed: ComputedOption): void {
  const again = computed.discountRecheck;
  const req = option.discountRequest;
  if (!again || !req) return;
  option.discountRequest = {
    ...req,
    state: 'pending',
    percent: again.percent,
    decidedBy: null,
    decidedAt: null,
    reason: again.reason,
  };
  option.pricing = { ...option.pricing, discounts: [] };
}

/**
 * One write to an option: read the job and the option, check the version, make the change, take the
 * ready mark off, re-check an approved discount against the new price, store, and answer with the
 * option worked out again. A change that returns false stored nothing (no flush, the mark stays).
 */
async function changeOption(
  ctx: ServiceContext,
  ids: OptionIds,
  version: number,
  present: (v: OptionView) => unknown,
  change: (desk: DeskJob, option: DesignOption) => void | boolean | Promise<void | boolean>,
): Promise<OptionView> {
  const { desk, option } = await lockedOption(ctx, ids, version, present);
  if ((await change(desk, option)) === false) return { option, computed: compute(desk, option) };
  touched(ctx, desk);
  recheckApproval(option, compute(desk, option));
  await ctx.em.flush();
  await ctx.em.populate(option, ['createdBy', 'reviewedBy']);
  return { option, computed: compute(desk, option) };
}

/**
 * Checks a new design against the job and the catalog before anything is stored: calc's references
 * (rooms, zones, equipment) with field paths, and that a newly chosen model is one the company still offers.
 */
function checkDesign(desk: DeskJob, option: DesignOption, design: DesignInput): Record<string, CatalogModel> {
  const before = new Set(modelKeysOf(option.design));
  const models = desk.data.desk.models;
  const errors: { path: string; message: string }[] = [];
  design.zones.forEach((z, i) => {
    const m = models.get(z.indoorUnitKey);
    if (!before.has(z.indoorUnitKey) && (!m || !m.active || m.kind !== 'indoor'))
      errors.push({ path: `design.zones.${i}.indoorUnitKey`, message: 'Choose an indoor unit the catalog offers.' });
  });
  design.systems.forEach((s, i) => {
    const m = models.get(s.outdoorUnitKey);
    if (!before.has(s.outdoorUnitKey) && (!m || !m.active || !m.kind.startsWith('outdoor-')))
      errors.push({
        path: `design.systems.${i}.outdoorUnitKey`,
        message: 'Choose an outdoor unit the catalog offers.',
      });
    const kit = s.heatKitKey ? models.get(s.heatKitKey) : undefined;
    if (s.heatKitKey && !before.has(s.heatKitKey) && (!kit || !kit.active || kit.kind !== 'heat-kit'))
      errors.push({ path: `design.systems.${i}.heatKitKey`, message: 'Choose a heat kit the catalog offers.' });
  });
  if (errors.length) throw new ValidationError(errors);
  if ('problem' in desk.home) throw new UnprocessableError(desk.home.problem.message, { errors: [desk.home.problem] });
  const trial = computeOption(
    { ...option, design, takeoffEdits: [], preliminary: false, discountRequest: null },
    desk.home,
    desk.data,
  );
  if (trial.problems.length)
    throw new ValidationError(
      trial.problems.map((p) => ({ path: p.path ? `design.${p.path}` : 'design', message: p.message })),
    );
  const chosen: Record<string, CatalogModel> = {};
  for (const k of modelKeysOf(design)) {
    const m = models.get(k) ?? option.chosenModels[k];
    if (m) chosen[k] = m;
  }
  return chosen;
}

/** Only the office sets the sell rule and the tax; anyone who prices may set discounts, deposit and plan. */
function checkPricingRights(ctx: ServiceContext, before: OptionPricing | null, after: OptionPricing): void {
  if (mayEditTakeoff(ctx.actor.role)) return;
  const office = (p: OptionPricing | null) => ({ sellRule: p?.sellRule ?? null, tax: p?.tax ?? null });
  if (!isDeepStrictEqual(office(before), office(after)))
    throw new ForbiddenError('Only an estimator or the owner sets the markup, margin or tax of an option.');
}

/**
 * Discounts within the person's limit (the price book's discount limits, by role) apply at once; beyond
 * it the option records a request for the owner, and the discounts already applied stay until approved.
 */
function applyDiscounts(
  ctx: ServiceContext,
  desk: DeskJob,
  option: DesignOption,
  pricing: OptionPricing,
  who: { id: string; name: string },
): OptionPricing {
  const applied = option.pricing?.discounts ?? [];
  if (isDeepStrictEqual(applied, pricing.discounts)) return pricing;
  if (pricing.discounts.length === 0 || mayDecideDiscount(ctx.actor.role)) {
    option.discountRequest = null;
    return pricing;
  }
  const trial = computeOption({ ...option, pricing }, desk.home, desk.data).figures;
  const check = checkDiscount({
    role: ctx.actor.role,
    discountCents: trial?.price.discountCents ?? 1,
    sellCents: trial?.price.sellCents ?? 0,
    limits: [...desk.data.desk.discountLimits.values()],
  });
  if (!check.needsOwnerApproval) {
    option.discountRequest = null;
    return pricing;
  }
  const { percent, limitPercent: limit } = check;
  option.discountRequest = {
    state: 'pending',
    discounts: pricing.discounts,
    percent,
    limitPercent: limit,
    requestedBy: who,
    requestedAt: ctx.clock.now().toISOString(),
    decidedBy: null,
    decidedAt: null,
  };
  return { ...pricing, discounts: applied };
}

export interface OptionInput {
  name?: string;
  design?: DesignInput;
  pricing?: OptionPricing;
}

const me = (ctx: ServiceContext) => ({ id: ctx.actor.userId, name: ctx.actor.name });

export async function createOption(
  ctx: ServiceContext,
  jobId: string,
  input: OptionInput & { name: string; copyFromOptionId?: string; preliminary?: boolean },
): Promise<OptionView> {
  const { em, actor } = ctx;
  const desk = await readDeskJob(ctx, jobId);
  const existing = await listOptions(ctx, desk.job.id);
  if (existing.length >= MAX_OPTIONS) throw new ConflictError(DESK_MESSAGES.tooManyOptions);
  const taken = new Set(existing.map((o) => o.position));
  const position = [1, 2, 3].find((p) => !taken.has(p)) ?? MAX_OPTIONS;
  const source = input.copyFromOptionId ? existing.find((o) => o.id === input.copyFromOptionId) : undefined;
  if (input.copyFromOptionId && !source)
    throw new ValidationError([{ path: 'copyFromOptionId', message: 'Choose an option of this job to copy.' }]);
  const option = em.create(DesignOptionSchema, {
    company: em.getReference(CompanySchema, actor.companyId),
    job: desk.job,
    position,
    name: input.name,
    design: source?.design ? designAsCalcReadsIt(source.design) : null,
    pricing: source?.pricing ?? optionPricingSchema.parse({}),
    takeoffEdits: source?.takeoffEdits ?? [],
    chosenModels: source?.chosenModels ?? {},
    discountRequest: null,
    preliminary: input.preliminary ?? (source ? source.preliminary && !mayReviewOption(actor.role) : false),
    createdBy: em.getReference(UserSchema, actor.userId),
  });
  await applyInputs(ctx, desk, option, { design: input.design, pricing: input.pricing });
  if (desk.job.status === 'walkthrough') desk.job.status = 'design';
  touched(ctx, desk);
  await em.flush();
  await em.populate(option, ['createdBy']);
  return { option, computed: compute(desk, option) };
}

async function applyInputs(
  ctx: ServiceContext,
  desk: DeskJob,
  option: DesignOption,
  input: OptionInput,
): Promise<void> {
  if (input.name !== undefined) option.name = input.name;
  if (input.design !== undefined) {
    option.chosenModels = checkDesign(desk, option, input.design);
    option.design = designAsCalcReadsIt(input.design);
  }
  if (input.pricing !== undefined) {
    checkPricingRights(ctx, option.pricing, input.pricing);
    const plan = input.pricing.financingPlanKey;
    if (plan && !desk.data.desk.financing.some((f) => f.key === plan))
      throw new ValidationError([
        { path: 'pricing.financingPlanKey', message: 'Choose one of the company’s financing plans.' },
      ]);
    option.pricing = applyDiscounts(ctx, desk, option, input.pricing, me(ctx));
  }
}

export async function updateOption(
  ctx: ServiceContext,
  jobId: string,
  optionId: string,
  version: number,
  input: OptionInput,
  present: (v: OptionView) => unknown,
): Promise<OptionView> {
  return changeOption(ctx, { jobId, optionId }, version, present, (desk, option) =>
    sameInputs(option, input) ? false : applyInputs(ctx, desk, option, input),
  );
}

/** Plain JSON values (what jsonb and the wire keep: no undefined keys), for comparing inputs. */
const asStored = (value: unknown): unknown => (value === undefined ? undefined : JSON.parse(JSON.stringify(value)));

/**
 * Whether a PATCH asks for what the option already holds: its name, its design as calc reads it
 * (desk-design.ts) and its pricing. Such a save changes nothing: no new version, and the job keeps its
 * ready mark (a change would take it off), so the desk's form saving back what it read is harmless.
 */
function sameInputs(option: DesignOption, input: OptionInput): boolean {
  if (input.name !== undefined && input.name !== option.name) return false;
  if (
    input.design !== undefined &&
    (!option.design ||
      !isDeepStrictEqual(asStored(designAsCalcReadsIt(input.design)), asStored(designAsCalcReadsIt(option.design))))
  )
    return false;
  return input.pricing === undefined || isDeepStrictEqual(asStored(input.pricing), asStored(option.pricing));
}

export async function deleteOption(
  ctx: ServiceContext,
  jobId: string,
  optionId: string,
  version: number,
  present: (v: OptionView) => unknown,
): Promise<void> {
  const { desk, option } = await lockedOption(ctx, { jobId, optionId }, version, present);
  ctx.em.remove(option);
  touched(ctx, desk);
  await ctx.em.flush();
}

/** The calc edit for an edit as sent, made against the line as generated now (null: no such line). */
function storedEdit(
  edit: TakeoffEditInput,
  generated: ReadonlyMap<string, { quantity: number; unitCostCents: number | null }>,
): StoredTakeoffEdit | null {
  if (edit.kind === 'add')
    return {
      kind: 'add',
      line: {
        itemKey: addedLineKey(edit.id),
        description: edit.description,
        quantity: edit.quantity,
        unit: edit.unit,
        category: edit.category,
        derivation: 'added by the estimator',
        unitCostCents: edit.unitCostCents,
      },
    };
  const line = generated.get(edit.itemKey);
  if (!line) return null;
  if (edit.kind === 'quantity') return { ...edit, generatedQuantity: line.quantity };
  if (edit.kind === 'unit-price') return { ...edit, generatedUnitCostCents: line.unitCostCents };
  return edit;
}

/** What the edit sets, to tell an edit sent back unchanged from a new one. */
const editValue = (e: TakeoffEditInput | StoredTakeoffEdit): unknown =>
  e.kind === 'quantity' ? e.quantity : e.kind === 'unit-price' ? e.unitCostCents : e.kind === 'add' ? e : null;

function generatedLines(desk: DeskJob, option: DesignOption) {
  const now = computeOption({ ...option, takeoffEdits: [] }, desk.home, desk.data);
  if (!now.figures)
    throw new UnprocessableError('The option cannot be worked out yet, so its takeoff cannot be edited.', {
      errors: now.problems,
    });
  return new Map(now.figures.lines.map((l) => [l.itemKey, { quantity: l.quantity, unitCostCents: l.unitCostCents }]));
}

/**
 * Replaces the option's takeoff edits. Each quantity, unit-price or remove edit must name a line calc
 * generates now; the generated value it replaces is stored with it, so the desk shows both. An edit sent
 * back unchanged keeps the value it was made against (it may no longer apply: regenerate decides).
 */
export async function setTakeoffEdits(
  ctx: ServiceContext,
  jobId: string,
  optionId: string,
  version: number,
  edits: TakeoffEditInput[],
  present: (v: OptionView) => unknown,
): Promise<OptionView> {
  if (!mayEditTakeoff(ctx.actor.role)) throw new ForbiddenError('Only an estimator or the owner edits the takeoff.');
  return changeOption(ctx, { jobId, optionId }, version, present, (desk, option) => {
    const generated = generatedLines(desk, option);
    const previous = new Map(option.takeoffEdits.map((s) => [takeoffEditKey(s), s]));
    const errors: { path: string; message: string }[] = [];
    const stored = edits.flatMap((edit, i): StoredTakeoffEdit[] => {
      const kept = previous.get(takeoffEditKey(edit));
      if (kept && edit.kind !== 'add' && isDeepStrictEqual(editValue(kept), editValue(edit))) return [kept];
      const s = storedEdit(edit, generated);
      if (!s) errors.push({ path: `edits.${i}.itemKey`, message: 'This line is not in the takeoff.' });
      return s ? [s] : [];
    });
    if (errors.length) throw new ValidationError(errors);
    option.takeoffEdits = stored;
  });
}

/**
 * After a design change: edits that still apply are kept; of those that no longer do, `accept` re-bases
 * each on the line as generated now (kept and applied; one whose line is gone goes), `drop` removes it,
 * and the rest stay listed.
 */
export async function regenerateTakeoff(
  ctx: ServiceContext,
  jobId: string,
  optionId: string,
  version: number,
  choice: { accept: string[]; drop: string[] },
  present: (v: OptionView) => unknown,
): Promise<OptionView> {
  if (!mayEditTakeoff(ctx.actor.role)) throw new ForbiddenError('Only an estimator or the owner edits the takeoff.');
  return changeOption(ctx, { jobId, optionId }, version, present, (desk, option) => {
    const generated = generatedLines(desk, option);
    const states = compute(desk, option).edits;
    option.takeoffEdits = states.flatMap((s): StoredTakeoffEdit[] => {
      if (!s.stale) return [s.stored];
      if (choice.drop.includes(s.key)) return [];
      if (!choice.accept.includes(s.key)) return [s.stored];
      const e = s.stored;
      if (e.kind === 'add') return [e];
      const again = storedEdit(e, generated);
      return again ? [again] : [];
    });
  });
}

/**
 * The owner approves or denies a discount beyond someone's limit; the decision is recorded with who and
 * when. An approved discount the price has since outgrown (see computeOption) is decided again.
 */
export async function decideDiscount(
  ctx: ServiceContext,
  jobId: string,
  optionId: string,
  version: number,
  approve: boolean,
  present: (v: OptionView) => unknown,
): Promise<OptionView> {
  return changeOption(ctx, { jobId, optionId }, version, present, (desk, option) => {
    recheckApproval(option, compute(desk, option));
    const req = option.discountRequest;
    if (!req || req.state !== 'pending')
      throw new ConflictError('No discount on this option is waiting for a decision.');
    option.discountRequest = {
      ...req,
      state: approve ? 'approved' : 'denied',
      decidedBy: me(ctx),
      decidedAt: ctx.clock.now().toISOString(),
    };
    if (approve) option.pricing = { ...option.pricing, discounts: req.discounts };
  });
}

/** The office reviews a first price from the phone: from now on it may be proposed. */
export async function reviewOption(
  ctx: ServiceContext,
  jobId: string,
  optionId: string,
  version: number,
  present: (v: OptionView) => unknown,
): Promise<OptionView> {
  return changeOption(ctx, { jobId, optionId }, version, present, (_desk, option) => {
    if (!option.preliminary) return false;
    option.preliminary = false;
    option.reviewedBy = ctx.em.getReference(UserSchema, ctx.actor.userId);
    option.reviewedAt = ctx.clock.now();
    return true;
  });
}

const isSizing = (b: BlockerRecord) => b.code === 'sizing-outside-range';

/**
 * Where a job may be marked ready to propose: in design, and again once proposed (a revision: the estimator
 * changes the desk, marks it ready and issues version N+1 while the job stays proposed) or lost (after the
 * buyer cancelled, or the office marked it lost; the next send moves it to proposed). Not won or
 * installed: that sale is settled. A signed version not cancelled refuses it first (live-signature.ts).
 */
export const READY_FROM: readonly Job['status'][] = ['design', 'proposed', 'lost'];

/**
 * Marks the job ready to propose, or refuses with every reason (422, the blockers listed). Units outside
 * their sizing range hold it unless the office gives the reason to propose them anyway; that reason is
 * kept with the mark (who, when, the units it covers) and goes with it.
 */
export async function markReady(
  ctx: ServiceContext,
  jobId: string,
  body: { sizingOverride?: { reason: string } } = {},
): Promise<DeskView<Job>> {
  if (!mayMarkReady(ctx.actor.role))
    throw new ForbiddenError('Only an estimator or the owner marks a job ready to propose.');
  const view = await getDeskToChange(ctx, jobId);
  const { job } = view.desk;
  const signed = await liveSignature(ctx.em, ctx.actor.companyId, job.id);
  if (signed) {
    const message = PROPOSAL_MESSAGES.signed(signed.versionNumber, signed.signedOn, signed.signerName);
    throw new UnprocessableError(message, { errors: [{ path: 'status', message }], signed });
  }
  if (!READY_FROM.includes(job.status))
    throw new UnprocessableError(
      `A job is marked ready to propose while in design, proposed or lost; this one is ${job.status}.`,
      { errors: [{ path: 'status', message: `The job is ${job.status}.` }] },
    );
  const sizing = view.blockers.filter(isSizing);
  const reason = body.sizingOverride?.reason;
  const hard = view.blockers.filter((b) => !isSizing(b));
  if (hard.length || (sizing.length && reason === undefined))
    throw new UnprocessableError(
      hard.length ? 'The job cannot be marked ready to propose yet.' : DESK_MESSAGES.sizingOverrideNeeded,
      {
        errors: [
          ...view.blockers.map((b) => ({
            path: b.optionId ? `options.${b.optionId}` : 'options',
            message: b.message,
          })),
          ...(hard.length === 0
            ? [{ path: 'sizingOverride.reason', message: DESK_MESSAGES.sizingOverrideNeeded }]
            : []),
        ],
        blockers: view.blockers,
      },
    );
  job.readyAt = ctx.clock.now();
  job.readyBy = ctx.em.getReference(UserSchema, ctx.actor.userId);
  job.readyOverride =
    sizing.length && reason !== undefined
      ? { reason, by: me(ctx), at: job.readyAt.toISOString(), units: sizing.map((b) => b.message) }
      : null;
  await ctx.em.flush();
  await ctx.em.populate(job, ['readyBy']);
  return view;
}

export async function unmarkReady(ctx: ServiceContext, jobId: string): Promise<DeskView<Job>> {
  if (!mayMarkReady(ctx.actor.role))
    throw new ForbiddenError('Only an estimator or the owner marks a job ready to propose.');
  const view = await getDeskToChange(ctx, jobId);
  view.desk.job.readyAt = null;
  view.desk.job.readyBy = null;
  view.desk.job.readyOverride = null;
  await ctx.em.flush();
  return view;
}

function homeFor(desk: DeskJob) {
  if ('problem' in desk.home) throw new UnprocessableError(desk.home.problem.message, { errors: [desk.home.problem] });
  return desk.home.parsed;
}

const activeModels = (desk: DeskJob) => [...desk.data.desk.models.values()].filter((m) => m.active);

/** calc's suggestion from the company's active catalog for this job (nothing is stored: the desk applies it). */
export async function suggestForJob(
  ctx: ServiceContext,
  jobId: string,
  input: { zones?: GivenZone[]; lineLengthFt?: number; circuits?: CircuitInput[] },
): Promise<Suggestion> {
  const desk = await readDeskJob(ctx, jobId);
  return suggestDesign({
    home: homeFor(desk),
    models: activeModels(desk),
    ...(input.zones ? { zones: input.zones } : {}),
    ...(input.lineLengthFt ? { lineLengthFt: input.lineLengthFt } : {}),
    ...(input.circuits ? { circuits: input.circuits } : {}),
  });
}

/**
 * "A first price before leaving": one option filled from calc's suggestion and the price book, marked
 * preliminary (not proposable until the office reviews it), with its range.
 */
export async function createFirstPrice(ctx: ServiceContext, jobId: string, name: string): Promise<OptionView> {
  const desk = await readDeskJob(ctx, jobId);
  const suggestion = suggestDesign({ home: homeFor(desk), models: activeModels(desk) });
  if (suggestion.design.zones.length === 0 || suggestion.design.systems.length === 0)
    throw new UnprocessableError('No unit in the catalog fits this home yet; the estimator chooses the equipment.', {
      errors: suggestion.warnings.map((message) => ({ path: 'design', message })),
    });
  return createOption(ctx, jobId, { name, design: suggestion.design, preliminary: true });
}
