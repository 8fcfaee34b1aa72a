import { isDeepStrictEqual } from 'node:util';
import {
  CalcError,
  computeDesignFromParsed,
  DEFAULT_SIZING_POLICY,
  designSchema,
  homeInputSchema,
  parseOrThrow,
  priceBookSchema,
  type Home,
  type HomeLoad,
  homeLoadFromParsed,
  FIRST_PRICE_RUNS_FT,
  preliminaryPriceRange,
  type PreliminaryRange,
  type Design,
  designCatalogFromModels,
  designPriceBookFromCompany,
  extendCents,
  monthlyPaymentCents,
  priceOption,
  pricingSchema,
  roundHalfUp,
  type CatalogModel,
  type DesignResult,
  type EquipmentCatalog,
  type HomeInput,
  type OptionPrice,
  type PricedLine,
  type PriceBook,
  type Pricing,
  type SellRule,
  regenerateTakeoff,
  explainOptionPrice,
  explainLineSell,
  explainLineTax,
  type Explanation,
  type MergedLine,
  type LineSell,
  type StaleEdit,
} from '@calc';
import { DESK_MESSAGES, takeoffEditKey, type BlockerRecord, type OptionPricing } from '@contract';
import type { FieldError } from '../../lib/errors';
import type { CompanyDesk } from './desk-inputs';
import type { DesignOption, StoredTakeoffEdit } from './option.entity';

/** What an option's figures are worked out from: its inputs (an entity, a row, or a trial copy of either). */
export type OptionInputs = Pick<
  DesignOption,
  'id' | 'name' | 'design' | 'pricing' | 'takeoffEdits' | 'chosenModels' | 'discountRequest' | 'preliminary'
>;

/** A takeoff line as the desk holds it: calc's merged line (generated value beside the edited one), priced. */
export interface DeskLine extends MergedLine {
  readonly extendedCostCents: number;
  /** The line at its sell price with the rule that priced it (set once the option is priced). */
  readonly sell?: LineSell;
}

export interface EditState {
  readonly key: string;
  readonly stored: StoredTakeoffEdit;
  /** Why the edit no longer applies (calc's regenerateTakeoff); null when it is applied. */
  readonly stale: StaleEdit | null;
}

export interface OptionFigures {
  readonly design: DesignResult;
  readonly lines: readonly DeskLine[];
  readonly price: OptionPrice;
  readonly discountPercent: number;
  readonly sellRule: SellRule;
  readonly monthly: {
    planKey: string;
    name: string;
    aprPercent: number;
    months: number;
    monthlyPaymentCents: number;
  }[];
  /** calc's why of each number (the presenter passes on what the role may see). */
  readonly explanations: readonly Explanation[];
  /** A preliminary option's range: the design priced with short and with long runs, widened (calc). */
  readonly range: PreliminaryRange | null;
}

export interface ComputedOption {
  readonly figures: OptionFigures | null;
  readonly discontinued: { key: string; name: string }[];
  readonly problems: FieldError[];
  readonly edits: EditState[];
  readonly blockers: BlockerRecord[];
  /**
   * An approved discount the price has since outgrown: beyond the approved percent and the requester's
   * limit, so it is not applied and waits for the owner again (the percent now and why); else null.
   */
  readonly discountRecheck: { percent: number; reason: string } | null;
}

/**
 * Issue 13: an owner approved a discount at some percent of the price; when the price later drops (a
 * smaller design, a cheaper price book), an amount discount becomes a larger share. Beyond both the
 * approved percent and the requester's limit, the approval no longer covers it.
 */
function recheckDiscount(option: OptionInputs, price: OptionPrice): { percent: number; reason: string } | null {
  const req = option.discountRequest;
  if (req?.state !== 'approved' || price.discountCents <= 0) return null;
  if (!isDeepStrictEqual(option.pricing.discounts, req.discounts)) return null;
  const percent = price.sellCents > 0 ? roundHalfUp((price.discountCents / price.sellCents) * 100, 2) : 100;
  if (percent <= req.percent || percent <= req.limitPercent) return null;
  return {
    percent,
    reason: `The price has dropped since the owner approved this discount: it is now ${percent} % of the price (approved at ${req.percent} %; the limit is ${req.limitPercent} %), so it waits for the owner again and is not applied.`,
  };
}

/** The company's catalog and price book as the engine reads them, built once per request. */
export interface EngineData {
  readonly desk: CompanyDesk;
  readonly catalog: EquipmentCatalog;
  readonly priceBook: PriceBook;
}

/** calc's bridge from the company's data to the engine's catalog and price book (every model, active or not). */
function bridge(desk: CompanyDesk, models: ReadonlyMap<string, CatalogModel>): Omit<EngineData, 'desk'> {
  return {
    catalog: designCatalogFromModels(models.values()),
    priceBook: priceBookSchema.parse(
      designPriceBookFromCompany({
        models: models.values(),
        materials: desk.materials.filter((m) => m.active),
        labor: desk.laborTasks.filter((t) => t.active),
        kits: desk.kits.filter((k) => k.active),
        refrigerants: desk.refrigerants,
        categories: desk.categories,
      }),
    ),
  };
}

export function engineData(desk: CompanyDesk): EngineData {
  return { desk, ...bridge(desk, desk.models) };
}

/**
 * A home parsed once for all of a job's options, and its loads worked out once for all of them (the
 * first option to need them fills `loads`; the others and the preliminary range reuse them).
 */
export interface ParsedHome {
  readonly parsed: Home;
  loads?: HomeLoad;
}

/** The job's home through calc's schema, once per request; a refusal is the options' problem. */
export function parseHome(home: HomeInput | { problem: FieldError }): ParsedHome | { problem: FieldError } {
  if ('problem' in home) return home;
  try {
    return { parsed: parseOrThrow(homeInputSchema, home) };
  } catch (e) {
    const [first] = problemsOf(e);
    return {
      problem: {
        path: first?.path ? `rooms.${first.path}` : 'rooms',
        message: first?.message ?? 'The home cannot be worked out.',
      },
    };
  }
}

/** The models a design names (indoor units of its zones, outdoor units and heat kits of its systems). */
export function modelKeysOf(design: DesignOption['design']): string[] {
  if (!design) return [];
  const keys = new Set<string>();
  for (const z of design.zones ?? []) keys.add(z.indoorUnitKey);
  for (const s of design.systems ?? []) {
    keys.add(s.outdoorUnitKey);
    if (s.heatKitKey) keys.add(s.heatKitKey);
  }
  return [...keys];
}

/**
 * calc's pricing from the option's inputs and the company's rules (tax unless the option overrides it). The
 * sell price: an option with its own rule prices every line by it ('option'); otherwise each line sells at
 * the price book's rule for its item, its category's, or the company default ('line', issue 13).
 */
export function calcPricing(
  p: OptionPricing,
  desk: CompanyDesk,
  discounts = p.discounts,
): { pricing: Pricing; sellRule: SellRule } {
  const sellRule = p.sellRule ?? desk.settings.defaultSellRule;
  const plan = p.financingPlanKey ? desk.financing.find((f) => f.key === p.financingPlanKey) : undefined;
  const pricing = pricingSchema.parse({
    method: sellRule.method,
    percent: sellRule.percent,
    sellRulesBy: p.sellRule ? 'option' : 'line',
    discounts,
    taxRatePercent: p.tax?.taxRatePercent ?? desk.settings.taxRatePercent,
    taxOn: p.tax?.taxOn ?? desk.settings.taxAppliesTo,
    deposit: p.deposit,
    financing: plan ? { aprPercent: plan.aprPercent, months: plan.months } : undefined,
  });
  return { pricing, sellRule };
}

/**
 * Lays the estimator's takeoff edits over calc's generated lines with calc's regenerateTakeoff: an edit
 * applies while its line is generated with the value it replaced; otherwise it is kept, not applied,
 * and said why (regenerate lets the estimator accept it on the new value or drop it).
 */
export function applyTakeoffEdits(
  generated: readonly PricedLine[],
  edits: readonly StoredTakeoffEdit[],
): { lines: DeskLine[]; edits: EditState[] } {
  const merged = regenerateTakeoff({ next: generated, edits });
  const stale = new Map(merged.staleEdits.map((s) => [s.edit, s]));
  const lines = merged.lines.map((l) => ({
    ...l,
    extendedCostCents: l.unitCostCents === null ? 0 : extendCents({ quantity: l.quantity, unitCents: l.unitCostCents }),
  }));
  return { lines, edits: edits.map((e) => ({ key: takeoffEditKey(e), stored: e, stale: stale.get(e) ?? null })) };
}

/** The models an option names that the company no longer offers: retired (inactive) or deleted from the catalog. */
function discontinuedOf(option: OptionInputs, desk: CompanyDesk): { key: string; name: string }[] {
  return modelKeysOf(option.design).flatMap((key) => {
    const now = desk.models.get(key);
    if (now?.active) return [];
    const then = now ?? option.chosenModels[key];
    return [{ key, name: then?.name ?? key }];
  });
}

/** The engine data for one option: the company's, plus the chosen models the catalog has lost. */
function dataFor(option: OptionInputs, data: EngineData): EngineData {
  const missing = modelKeysOf(option.design).filter((k) => !data.desk.models.has(k) && option.chosenModels[k]);
  if (missing.length === 0) return data;
  const models = new Map<string, CatalogModel>(data.desk.models);
  for (const k of missing) {
    const m = option.chosenModels[k];
    if (m) models.set(k, m);
  }
  return { desk: data.desk, ...bridge(data.desk, models) };
}

function problemsOf(e: unknown): FieldError[] {
  if (e instanceof CalcError)
    return e.details.length
      ? e.details.map((d) => ({ path: d.path.map(String).join('.'), message: d.message }))
      : [{ path: '', message: e.message }];
  throw e;
}

/** Works one option out from its saved inputs (never from a figure a browser sent). */
export function computeOption(
  option: OptionInputs,
  home: HomeInput | ParsedHome | { problem: FieldError },
  data: EngineData,
  discounts?: OptionPricing['discounts'],
): ComputedOption {
  const discontinued = discontinuedOf(option, data.desk);
  const blockers: BlockerRecord[] = [];
  const block = (code: BlockerRecord['code'], message: string) =>
    blockers.push({ code, optionId: option.id, message: `${option.name}: ${message}` });
  if (option.discountRequest?.state === 'pending')
    block('discount-pending', option.discountRequest.reason ?? DESK_MESSAGES.discountPending);
  if (option.preliminary) block('preliminary', DESK_MESSAGES.preliminary);
  const noEdits = option.takeoffEdits.map((stored) => ({ key: takeoffEditKey(stored), stored, stale: null }));
  if ('problem' in home) {
    block('cannot-calculate', home.problem.message);
    return { figures: null, discontinued, problems: [home.problem], edits: noEdits, blockers, discountRecheck: null };
  }
  if (!option.design) {
    const problem = { path: 'design', message: 'Choose the equipment for this option.' };
    block('cannot-calculate', problem.message);
    return { figures: null, discontinued, problems: [problem], edits: noEdits, blockers, discountRecheck: null };
  }
  const own = dataFor(option, data);
  const asked = calcPricing(option.pricing, data.desk, discounts);
  const { sellRule } = asked;
  let { pricing } = asked;
  let design: DesignResult;
  let range: PreliminaryRange | null = null;
  try {
    // The home is parsed once per request (parseHome); the catalog and price book are already schema outputs.
    const shared: ParsedHome = 'parsed' in home ? home : { parsed: parseOrThrow(homeInputSchema, home) };
    // The home's loads do not depend on the option: computed once, shared by every option of the request.
    shared.loads ??= homeLoadFromParsed(shared.parsed);
    const loads = shared.loads;
    const parsedDesign = parseOrThrow(designSchema, option.design);
    const run = (d: Design) =>
      computeDesignFromParsed({
        home: shared.parsed,
        design: d,
        catalog: own.catalog,
        priceBook: own.priceBook,
        pricing,
        policy: DEFAULT_SIZING_POLICY,
        loads,
        // The desk prices the takeoff again after the estimator's edits and explains that price itself.
        explainPrice: false,
      });
    design = run(parsedDesign);
    if (option.preliminary) {
      // The walk-through measures no runs: the range prices every run short and long (calc's first-price rule).
      const withRuns = (lengthFt: number): Design => ({
        ...parsedDesign,
        systems: parsedDesign.systems.map((s) => ({ ...s, circuits: s.circuits.map((c) => ({ ...c, lengthFt })) })),
      });
      range = preliminaryPriceRange({
        lowTotalCents: run(withRuns(FIRST_PRICE_RUNS_FT.short)).price.totalCents,
        highTotalCents: run(withRuns(FIRST_PRICE_RUNS_FT.long)).price.totalCents,
      });
    }
  } catch (e) {
    const problems = problemsOf(e);
    block('cannot-calculate', problems.map((p) => p.message).join(' '));
    return { figures: null, discontinued, problems, edits: noEdits, blockers, discountRecheck: null };
  }
  const applied = applyTakeoffEdits(design.takeoff, option.takeoffEdits);
  let price = priceOption({ lines: applied.lines, pricing, priceBook: own.priceBook });
  const discountRecheck = discounts === undefined ? recheckDiscount(option, price) : null;
  if (discountRecheck) {
    pricing = calcPricing(option.pricing, data.desk, []).pricing;
    price = priceOption({ lines: applied.lines, pricing, priceBook: own.priceBook });
    block('discount-pending', discountRecheck.reason);
  }
  const lines: DeskLine[] = applied.lines.map((l, i) => {
    const sell = price.lineSells[i];
    return sell ? { ...l, sell } : l;
  });
  if (applied.edits.some((e) => e.stale)) block('takeoff-edits-stale', DESK_MESSAGES.takeoffStale);
  // Issue 13: a unit outside its allowed sizing range holds the ready mark unless the office gives a reason.
  for (const u of [...design.zones, ...design.systems]) {
    if (u.sizing.withinRange) continue;
    const ratio = u.explanations.find((e) => e.key.endsWith('cooling-ratio'));
    block('sizing-outside-range', `${u.name}: ${ratio?.verdict ?? 'outside the allowed sizing range'}.`);
  }
  // calc's blockers that belong to no one system's plans: a zone on no outdoor unit, a refrigerant past its rule's dates.
  for (const b of design.blockers)
    if (b.kind === 'connection' || b.kind === 'refrigerant-rule') block(b.code, b.message);
  for (const s of design.systems) {
    if (!s.combination.ok) block('combination-refused', s.combination.warnings.join(' ') || `${s.name}: refused.`);
    for (const b of s.refrigerant.blockers) block('limit-exceeded', b);
    // The outdoor unit's branch circuit and the heat kit's: no breaker or wire fits, or a disconnect out of sight.
    for (const e of s.heatKitElectrical ? [s.electrical, s.heatKitElectrical] : [s.electrical])
      if (e.breakerA === null || e.wireAwg === null || !e.disconnectWithinSight)
        for (const w of e.warnings) if (w !== e.circuitLengthAssumed) block('limit-exceeded', w);
  }
  const monthly = data.desk.financing.map((f) => ({
    planKey: f.key,
    name: f.name,
    aprPercent: f.aprPercent,
    months: f.months,
    monthlyPaymentCents: monthlyPaymentCents({
      principalCents: price.balanceCents,
      aprPercent: f.aprPercent,
      months: f.months,
    }),
  }));
  const discountPercent = price.sellCents > 0 ? roundHalfUp((price.discountCents / price.sellCents) * 100, 2) : 0;
  return {
    figures: {
      design,
      lines,
      price,
      discountPercent,
      sellRule,
      monthly,
      explanations: [
        ...price.lineSells.flatMap((line) => [
          explainLineSell({ line }),
          explainLineTax({ line, taxOn: pricing.taxOn }),
        ]),
        ...explainOptionPrice({ price, pricing, plans: data.desk.financing }),
      ],
      range,
    },
    discontinued,
    problems: [],
    edits: applied.edits,
    blockers,
    discountRecheck,
  };
}
