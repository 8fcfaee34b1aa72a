import { designCatalogFromModels, equipmentTypeOf } from '../catalog/design-bridge';
import type { CatalogModel } from '../catalog/model';
import { explanation, input, type Explanation } from '../explain/explanation';
import { formatNumber, formatPercent, formatQuantity } from '../explain/format';
import { coincidentLoad, homeLoadFromParsed, type HomeLoad } from '../loads/home-load';
import { parseOrThrow } from '../parse';
import { designSchema, type CircuitInput, type DesignInput } from '../schemas/design';
import { floorAreaFt2 } from '../geometry';
import { equipmentCatalogSchema, type IndoorUnit, type OutdoorUnit } from '../schemas/equipment';
import { homeInputSchema, type Home, type HomeInput } from '../schemas/home';
import { checkCombination, checkSizing, type LoadToMeet, type SizingCheck } from '../sizing/match';
import { DEFAULT_SIZING_POLICY, sizingPolicySchema, type SizingPolicy } from '../sizing/policy';
import { computeDesignFromParsed } from './compute-design';
import { designLoads } from './design-ducts';
import { priceBookSchema, pricingSchema } from '../pricing/schemas';

/** A suggested design: the input computeDesign takes, with why each unit was chosen. */
export interface Suggestion {
  readonly design: DesignInput;
  readonly reasons: readonly Explanation[];
  /** Zones or loads no active unit fits within the sizing range (the estimator decides). */
  readonly warnings: readonly string[];
}

/**
 * How many times suggest builds a candidate plan again on the desk's loads for the plan it built before (designLoads:
 * a ductless plan's heads are sized without the walk-through's ducts). Two builds settle a plan whose kind of unit
 * per zone does not change with the ducts; the rest allow a zone that moves between a head and a ducted one.
 */
export const SETTLE_BUILDS = 4;

/** Default run per circuit until the estimator measures it, ft. [TRADE: a typical one-wall mini-split run] */
export const SUGGEST_LINE_FT = 25;

interface ZoneDraft {
  key: string;
  name: string;
  roomIds: string[];
  load: LoadToMeet;
  /** The home's loads the zone is sized on: the desk's loads for the plan it is part of (designLoads). */
  on: HomeLoad;
}

const btuh = (v: number) => formatQuantity(Math.round(v), 'Btu/h');
const byNominal = (a: CatalogModel, b: CatalogModel) =>
  (a.nominalCoolingBtuh ?? 0) - (b.nominalCoolingBtuh ?? 0) ||
  a.costCents - b.costCents ||
  (a.key < b.key ? -1 : a.key > b.key ? 1 : 0);

function loadOf(loads: HomeLoad, roomIds: readonly string[]): LoadToMeet {
  const c = coincidentLoad({ loads, roomIds });
  return { sensibleBtuh: c.sensibleBtuh, latentBtuh: c.latentBtuh, heatingBtuh: c.heatingBtuh };
}

interface Chosen<U> {
  model: CatalogModel;
  unit: U;
  sizing: SizingCheck;
}

/**
 * How far a unit's cooling capacity at design falls outside the allowed range, in percentage points of the load
 * (0 when inside): 89 % against 90–130 % misses by 1, 134 % by 4.
 */
export function sizingMiss(s: SizingCheck): number {
  const pct = (s.coolingRatio ?? 0) * 100;
  return pct < s.allowedPercent.min ? s.allowedPercent.min - pct : Math.max(0, pct - s.allowedPercent.max);
}

/** The closer of two choices to their sizing range (the first on a tie). */
function closer<C extends { sizing: SizingCheck }>(a: C | null, b: C | null): C | null {
  if (a === null || b === null) return a ?? b;
  return sizingMiss(b.sizing) < sizingMiss(a.sizing) ? b : a;
}

/**
 * The smallest candidate within the sizing range, else the one closest to the range (the larger on a tie, as it
 * covers more of the load): a catalog whose sizes step past the load's range — 24k at 89 %, 36k at 134 % — gives
 * the 24k, one point short, not the 36k, four points over.
 */
function choose<U extends IndoorUnit | OutdoorUnit>(
  candidates: readonly { model: CatalogModel; unit: U }[],
  load: LoadToMeet,
  designF: { cooling: number; heating: number },
  policy: SizingPolicy,
): Chosen<U> | null {
  let best: Chosen<U> | null = null;
  for (const c of candidates) {
    const sizing = checkSizing({
      unit: c.unit,
      equipmentType: equipmentTypeOf(c.model),
      load,
      coolingDesignF: designF.cooling,
      heatingDesignF: designF.heating,
      policy,
    });
    const p = { model: c.model, unit: c.unit, sizing };
    if (sizing.withinRange) return p;
    if (best === null || sizingMiss(sizing) <= sizingMiss(best.sizing)) best = p;
  }
  return best;
}

/** "the smallest wall head in range", or "the wall head closest to the range" when none is in it. */
const smallestOr = (p: { sizing: SizingCheck }, what: string) =>
  p.sizing.withinRange ? `the smallest ${what} in range` : `the ${what} closest to the range`;

/** Why a unit outside its range is still the suggestion: the range, the load and how far the unit is from it. */
function outOfRange(what: string, zone: string, p: { model: CatalogModel; sizing: SizingCheck }): string {
  const pct = (p.sizing.coolingRatio ?? 0) * 100;
  return `No ${what} in the active catalog sizes ${zone} inside ${p.sizing.allowedPercent.min}–${formatPercent(p.sizing.allowedPercent.max)} of its ${btuh(p.sizing.coolingLoadBtuh)} cooling load: ${p.model.name} is the closest, at ${formatPercent(pct)} (the sizes either side of the load fall outside the range).`;
}

function reason(key: string, who: string, p: Chosen<IndoorUnit | OutdoorUnit>, why: string): Explanation {
  const pct = (p.sizing.coolingRatio ?? 0) * 100;
  return explanation({
    key,
    label: `Suggested for ${who}`,
    value: p.sizing.coolingCapacityBtuh,
    unit: 'Btu/h',
    valueText: p.model.name,
    text: `${p.model.name}: ${btuh(p.sizing.coolingCapacityBtuh)} at design for ${btuh(p.sizing.coolingLoadBtuh)} = ${formatPercent(pct)} of the load (range ${p.sizing.allowedPercent.min}–${formatPercent(p.sizing.allowedPercent.max)}); ${why}`,
    // The load is the desk's for this plan (designLoads): a ductless unit's without the walk-through's ducts.
    inputs: [
      input('Cooling load at design', p.sizing.coolingLoadBtuh, 'Btu/h', btuh(p.sizing.coolingLoadBtuh)),
      input('Cooling capacity at design', p.sizing.coolingCapacityBtuh, 'Btu/h', btuh(p.sizing.coolingCapacityBtuh)),
    ],
    status: p.sizing.withinRange ? 'ok' : 'warning',
    source: 'Active catalog, company sizing policy',
  });
}

/** A zone the estimator already has: its rooms, and what the A2L check needs to know of them (kept as given). */
export interface GivenZone {
  readonly key: string;
  readonly name: string;
  readonly roomIds: readonly string[];
  readonly headRoomId?: string;
  readonly openSpace?: boolean;
  readonly lowestDuctOpeningFt?: number;
}

/**
 * A single room at least this large (ft²) gets a ceiling cassette when the catalog has one in range.
 * [OWN: common practice — a four-way cassette spreads air over a large open room better than a wall head]
 */
export const CASSETTE_MIN_FT2 = 300;

/** Btu/h per kW of electric heat. [PUB: 1 W = 3.412 142 Btu/h, the IT Btu definition] */
const BTUH_PER_KW = 3412.142;

/** A ductless head's or unit's candidate kind: a head across closed rooms must be a ducted one. */
type HeadKind = 'ducted' | 'cassette' | 'wall';

/**
 * One way to serve some zones: the design's zones and systems with why, and every sizing verdict computeDesign will
 * give them (the zone's and the system's), so candidates compare on the same verdicts the desk shows.
 */
interface Plan {
  readonly zones: DesignInput['zones'];
  readonly systems: DesignInput['systems'];
  readonly reasons: Explanation[];
  readonly warnings: string[];
  readonly sizings: SizingCheck[];
  /** Zones whose head is not of the kind that suits them (a wall head where a cassette suits a large room). */
  unsuited: number;
  /** Equipment cost of the plan, cents (the last tie-breaker between plans equally close to their ranges). */
  costCents: number;
}

const emptyPlan = (): Plan => ({
  zones: [],
  systems: [],
  reasons: [],
  warnings: [],
  sizings: [],
  unsuited: 0,
  costCents: 0,
});

function joinPlans(plans: readonly Plan[]): Plan {
  const out = emptyPlan();
  for (const p of plans) {
    out.zones.push(...p.zones);
    out.systems.push(...p.systems);
    out.reasons.push(...p.reasons);
    out.warnings.push(...p.warnings);
    out.sizings.push(...p.sizings);
    out.unsuited += p.unsuited;
    out.costCents += p.costCents;
  }
  return out;
}

/**
 * How a plan compares (lower is better, in this order): what would stop the job being marked ready (an A2L room too
 * small for the system's charge, a line past its limit, a refused combination — computeDesign's blockers), units outside
 * their range, percentage points outside, heads not of the kind that suits their zone, equipment cost.
 */
export interface PlanScore {
  readonly blockers: number;
  readonly outOfRange: number;
  readonly missPoints: number;
  readonly unsuited: number;
  readonly costCents: number;
}

function scoreOf(p: Plan, blockers: number): PlanScore {
  return {
    blockers,
    outOfRange: p.sizings.filter((x) => !x.withinRange).length,
    missPoints: Math.round(p.sizings.reduce((s, x) => s + sizingMiss(x), 0) * 10) / 10,
    unsuited: p.unsuited,
    costCents: p.costCents,
  };
}

/** Negative when a is the better plan. */
function compareScores(a: PlanScore, b: PlanScore): number {
  return (
    a.blockers - b.blockers ||
    a.outOfRange - b.outOfRange ||
    a.missPoints - b.missPoints ||
    a.unsuited - b.unsuited ||
    a.costCents - b.costCents
  );
}

/**
 * Zones into groups for `units` multi-zone outdoor units, by capacity: the largest zone first, each to the group with
 * the least load so far that still has a port free (at most `ports` zones in a group) — the groups' loads come out
 * about even, so each outdoor unit can be sized near its share. [OWN: longest-processing-time-first, a standard
 * balancing heuristic; common practice: spread heads so each outdoor unit carries a similar load]
 */
export function groupByCapacity<Z>(zones: readonly Z[], loadOf: (z: Z) => number, units: number, ports: number): Z[][] {
  const groups: { zones: Z[]; load: number }[] = Array.from({ length: units }, () => ({ zones: [], load: 0 }));
  const order = zones.map((z, i) => ({ z, i, load: loadOf(z) })).sort((a, b) => b.load - a.load || a.i - b.i);
  for (const { z, load } of order) {
    let best: { zones: Z[]; load: number } | null = null;
    for (const g of groups) if (g.zones.length < ports && (best === null || g.load < best.load)) best = g;
    if (best === null) return [];
    best.zones.push(z);
    best.load += load;
  }
  // Each group keeps its zones in the home's order (the design lists them as the walk-through does).
  return groups.map((g) => g.zones.sort((a, b) => zones.indexOf(a) - zones.indexOf(b)));
}

/**
 * Suggests equipment from the active catalog for a home (issue 13, "suggest"). Every plan it considers keeps the rule
 * that a ductless head (wall, cassette, console) serves the room it is in, or rooms the estimator marked as one open
 * space; several closed rooms share a ducted unit (slim ducted head or air handler), whose ducts reach each room
 * [OWN: common practice — a head's air does not reach a closed room; the A2L room-size check takes the head's room].
 * - No zones given: the candidates are (a) a ducted heat pump with its matched air handler on the rooms the home's ducts
 *   serve (house.ducts), the other rooms ductless, when the home has ducts; (b) every room ductless: one head per room,
 *   except rooms too small for any head in range (the smallest head would be oversized), which share a slim ducted
 *   head with other small rooms of their floor. Each candidate's heads go on multi-zone outdoor units (one, else two,
 *   three…, grouped by capacity and, as a second try, in the home's order — each within its ports, port sizes and
 *   connected range) or single-zone pairs, whichever plan scores better. Plans score (PlanScore) on computeDesign's
 *   blockers (an A2L room too small for the charge, a line past its limit, a refused combination), then units outside
 *   their range, percentage points outside, heads not of the kind that suits their zone, and equipment cost; the
 *   reasons list every candidate's verdict.
 * - Zones given: kept as given. A zone no head can meet, or several closed rooms the home's ducts serve, goes on a
 *   ducted heat pump when that comes closer to the range than a head of the kind the zone suits; a zone of several
 *   closed rooms gets a slim ducted head (never a wall head), or when the catalog has none, is split into its rooms.
 * Every plan is sized on the loads the desk will show for it (designLoads, the path computeDesign takes): a ductless
 * unit without the walk-through's ducts, a ducted unit with the ducts of the rooms it serves (`settle`).
 * Each unit is the smallest of its kind in range, else the closest to it, with a warning saying so. A ducted heat pump
 * that falls short of the heat loss at the design temperature gets the smallest matched heat kit covering the
 * shortfall. Candidates are ordered by nominal size, cost, then key, so the same inputs always give the same
 * suggestion. A circuit the estimator already entered for a zone (`circuits`) is kept as entered; new ones run
 * SUGGEST_LINE_FT.
 */
export function suggestDesign({
  home: homeIn,
  models,
  policy = DEFAULT_SIZING_POLICY,
  zones: givenZones,
  lineLengthFt = SUGGEST_LINE_FT,
  circuits: entered = [],
}: {
  readonly home: HomeInput;
  readonly models: readonly CatalogModel[];
  readonly policy?: SizingPolicy;
  readonly zones?: readonly GivenZone[];
  readonly lineLengthFt?: number;
  readonly circuits?: readonly CircuitInput[];
}): Suggestion {
  const home = parseOrThrow(homeInputSchema, homeIn);
  /**
   * The loads of the home as designLoads changes it for a plan (only its ducts change): worked once per set of
   * ducts, so a plan tried again, or scored by computeDesign, finds them kept.
   */
  const worked = new Map<string, HomeLoad>();
  const loadsOf = (h: Home): HomeLoad => {
    const k = JSON.stringify([h.ducts ?? null, h.ductSystems ?? null]);
    let l = worked.get(k);
    if (!l) worked.set(k, (l = homeLoadFromParsed(h)));
    return l;
  };
  const walked = loadsOf(home);
  const dc = home.designConditions;
  const designF = { cooling: dc.outdoorCoolingDryBulbF, heating: dc.outdoorHeatingDryBulbF };
  const active = models.filter((m) => m.active).sort(byNominal);
  const engine = designCatalogFromModels(active);
  const indoorByKey = new Map(engine.indoorUnits.map((u) => [u.key, u]));
  const outdoorByKey = new Map(engine.outdoorUnits.map((u) => [u.key, u]));
  const roomsById = new Map(home.rooms.map((r) => [r.id, r]));
  const roomOrder = new Map(home.rooms.map((r, i) => [r.id, i]));
  const pairOf = (m: CatalogModel) =>
    m.matchedKeys.map((k) => active.find((o) => o.key === k)).find((o) => o?.kind === 'outdoor-single-zone');
  const kindOf = (m: CatalogModel): HeadKind | null =>
    m.indoorType === 'slim-ducted'
      ? 'ducted'
      : m.indoorType === 'ceiling-cassette'
        ? 'cassette'
        : m.indoorType === 'wall' || m.indoorType === undefined
          ? 'wall'
          : null;
  const heads = active.filter((m) => m.kind === 'indoor' && kindOf(m) !== null);
  const headsOf = (list: CatalogModel[]) =>
    list.flatMap((m) => {
      const unit = indoorByKey.get(m.key);
      return unit ? [{ model: m, unit }] : [];
    });
  const multiHeads = heads.filter((m) => pairOf(m) === undefined);
  const multiOutdoors = active.flatMap((m) => {
    const unit = m.kind === 'outdoor-multi-zone' ? outdoorByKey.get(m.key) : undefined;
    return unit ? [{ model: m, unit }] : [];
  });
  const maxPorts = Math.max(0, ...multiOutdoors.map((o) => o.unit.maxHeads));
  const costOf = (...keys: (string | undefined)[]) =>
    keys.reduce((s, k) => s + (active.find((m) => m.key === k)?.costCents ?? 0), 0);
  const electrical = { circuitLengthFt: 30 };
  let tokens = 0;
  /** A placeholder key for a plan's system (and its reasons) until the chosen plan numbers its systems s1, s2… */
  const token = () => `plan.${(tokens += 1)}.system`;
  // What computeDesign needs to judge a plan: the prices play no part in its blockers.
  const parsedCatalog = parseOrThrow(equipmentCatalogSchema, engine);
  const parsedIndoor = new Map(parsedCatalog.indoorUnits.map((u) => [u.key, u]));
  const parsedPolicy = parseOrThrow(sizingPolicySchema, policy);
  const noPrices = parseOrThrow(priceBookSchema, { items: {}, laborRateCents: 0 });
  const noPricing = parseOrThrow(pricingSchema, { method: 'margin', percent: 0 });
  /** computeDesign's blockers for a plan (its zones and systems alone), as the desk will find them. */
  const blockersOf = (p: Plan): number => {
    if (p.zones.length === 0) return 0;
    try {
      return computeDesignFromParsed({
        home,
        design: parseOrThrow(designSchema, { zones: p.zones, systems: p.systems }),
        catalog: parsedCatalog,
        priceBook: noPrices,
        pricing: noPricing,
        policy: parsedPolicy,
        loadsOf,
        explainPrice: false,
      }).blockers.length;
    } catch {
      return Number.POSITIVE_INFINITY;
    }
  };
  const scores = new WeakMap<Plan, PlanScore>();
  const score = (p: Plan): PlanScore => {
    let sc = scores.get(p);
    if (!sc) scores.set(p, (sc = scoreOf(p, blockersOf(p))));
    return sc;
  };
  /** The better of two plans (the first on a tie). */
  const better = (a: Plan | null, b: Plan | null): Plan | null => {
    if (a === null || b === null) return a ?? b;
    return compareScores(score(b), score(a)) < 0 ? b : a;
  };
  const enteredByZone = new Map(entered.map((c) => [c.zoneKey, c]));
  const circuit = (zoneKey: string): CircuitInput => enteredByZone.get(zoneKey) ?? { zoneKey, lengthFt: lineLengthFt };
  const zoneInput = (z: Draft, indoorUnitKey: string): DesignInput['zones'][number] => ({
    key: z.key,
    name: z.name,
    roomIds: z.roomIds,
    indoorUnitKey,
    ...(z.given?.headRoomId !== undefined ? { headRoomId: z.given.headRoomId } : {}),
    ...(z.given?.openSpace !== undefined ? { openSpace: z.given.openSpace } : {}),
    ...(z.given?.lowestDuctOpeningFt !== undefined ? { lowestDuctOpeningFt: z.given.lowestDuctOpeningFt } : {}),
  });
  type Draft = ZoneDraft & { given?: GivenZone };
  const draft = (key: string, roomIds: string[], on: HomeLoad, given?: GivenZone, name?: string): Draft => ({
    key,
    name:
      given?.name ??
      name ??
      roomIds
        .map((id) => roomsById.get(id)?.name ?? id)
        .join(' + ')
        .slice(0, 80),
    roomIds,
    load: loadOf(on, roomIds),
    on,
    ...(given ? { given } : {}),
  });
  const coolingOf = (z: ZoneDraft) => z.load.sensibleBtuh + z.load.latentBtuh;
  /** Several rooms not marked as one open space: only a ducted unit serves them all. */
  const closedRooms = (z: Draft) => z.roomIds.length > 1 && z.given?.openSpace !== true;
  const areaOf = (z: ZoneDraft) => z.roomIds.reduce((sum, id) => sum + floorAreaFt2(roomsById.get(id) ?? {}), 0);
  const suits = (z: Draft): HeadKind =>
    closedRooms(z) ? 'ducted' : areaOf(z) >= CASSETTE_MIN_FT2 ? 'cassette' : 'wall';
  const size = <U extends IndoorUnit | OutdoorUnit>(c: readonly { model: CatalogModel; unit: U }[], load: LoadToMeet) =>
    choose(c, load, designF, policy);
  /**
   * The head for a zone among `options(kind)`: of the kind that suits it, the smallest in range. A zone of closed
   * rooms takes a ducted head or none; a one-room zone takes a wall head when the suited kind has none in range and a
   * wall head comes closer.
   */
  const pick = <U extends IndoorUnit | OutdoorUnit>(
    z: Draft,
    options: (kind: HeadKind) => readonly { model: CatalogModel; unit: U }[],
  ): Chosen<U> | null => {
    const kind = suits(z);
    const first = size(options(kind), z.load);
    if (kind === 'ducted' || first?.sizing.withinRange) return first;
    if (kind === 'wall') return first;
    const wall = size(options('wall'), z.load);
    return wall?.sizing.withinRange ? wall : closer(first, wall);
  };

  // ---- Ducted heat pumps with their matched air handlers (and heat kits).
  const ductRooms = home.ducts
    ? (home.ducts.roomIds ?? home.rooms.map((r) => r.id)).filter((id) => roomsById.has(id))
    : [];
  const largestHead = Math.max(0, ...headsOf(heads).map((h) => h.unit.nominalBtuh));
  const airHandlers = active.filter((m) => m.kind === 'indoor' && m.indoorType === 'air-handler');
  const ductedCandidates = active
    .filter((m) => m.kind === 'outdoor-ducted')
    .flatMap((o) => {
      const unit = outdoorByKey.get(o.key);
      const handler = airHandlers.find((a) => o.matchedKeys.includes(a.key) || a.matchedKeys.includes(o.key));
      return unit && handler && indoorByKey.has(handler.key) ? [{ model: o, unit, handler }] : [];
    });
  /** A ducted heat pump with its air handler for a zone: sized as the matched pair (computeDesign's zoneRating). */
  const ductedPlan = (z: Draft): Plan | null => {
    const p = size(ductedCandidates, z.load);
    const handler = p ? ductedCandidates.find((c) => c.model.key === p.model.key)?.handler : undefined;
    if (!p || !handler) return null;
    const plan = emptyPlan();
    const key = token();
    if (!p.sizing.withinRange) plan.warnings.push(outOfRange('ducted heat pump', z.name, p));
    let heatKitKey: string | undefined;
    const capacity = p.sizing.heatingCapacityBtuh;
    const shortfall = capacity === null ? 0 : z.load.heatingBtuh - capacity;
    if (shortfall > 0) {
      const kits = active
        .filter((k) => k.kind === 'heat-kit' && k.heatKitKw !== undefined && k.matchedKeys.includes(handler.key))
        .sort((a, b) => (a.heatKitKw ?? 0) - (b.heatKitKw ?? 0) || byNominal(a, b));
      const kit = kits.find((k) => (k.heatKitKw ?? 0) * BTUH_PER_KW >= shortfall) ?? kits[kits.length - 1];
      if (kit) {
        heatKitKey = kit.key;
        plan.reasons.push(
          explanation({
            key: `suggest:${key}:heat-kit`,
            label: `Backup heat for ${z.name}`,
            value: kit.heatKitKw ?? 0,
            unit: 'kW',
            valueText: kit.name,
            text: `${btuh(z.load.heatingBtuh)} heat loss − ${btuh(capacity ?? 0)} from ${p.model.name} at ${designF.heating} °F = ${btuh(shortfall)} short; ${kit.name}: ${formatQuantity(kit.heatKitKw ?? 0, 'kW')} × 3,412 = ${btuh((kit.heatKitKw ?? 0) * BTUH_PER_KW)}`,
            status: (kit.heatKitKw ?? 0) * BTUH_PER_KW >= shortfall ? 'ok' : 'warning',
            source: 'Active catalog; 1 W = 3.412 Btu/h',
          }),
        );
      } else
        plan.warnings.push(
          `${p.model.name} falls ${btuh(shortfall)} short of the heat loss of ${z.name} at ${designF.heating} °F, and no heat kit in the catalog fits ${handler.name}.`,
        );
    }
    plan.reasons.push(
      reason(
        `suggest:${z.key}`,
        z.name,
        p,
        `${smallestOr(p, 'ducted heat pump')}, with ${handler.name} (the matched pair's rating)`,
      ),
    );
    plan.zones.push(zoneInput(z, handler.key));
    plan.systems.push({
      key,
      name: `${z.name} ducted system`.slice(0, 80),
      outdoorUnitKey: p.model.key,
      circuits: [circuit(z.key)],
      electrical,
      ...(heatKitKey ? { heatKitKey } : {}),
    });
    // The zone and the system are the same pair: computeDesign gives both this verdict.
    plan.sizings.push(p.sizing, p.sizing);
    plan.costCents = costOf(p.model.key, handler.key, heatKitKey);
    return plan;
  };

  // ---- Ductless: heads on multi-zone units or single-zone pairs.
  const refusals: string[] = [];
  /** The smallest multi-zone unit in range for these zones' heads, else the closest; null when none takes them. */
  const multiFor = (group: readonly Draft[], chosen: readonly Chosen<IndoorUnit>[]) => {
    const on = group[0]?.on ?? walked;
    const all = loadOf(
      on,
      group.flatMap((z) => z.roomIds),
    );
    let best: { model: CatalogModel; unit: OutdoorUnit; sizing: SizingCheck; connected: number } | null = null;
    for (const { model, unit } of multiOutdoors) {
      const combo = checkCombination({ outdoor: unit, indoor: chosen.map((h) => h.unit) });
      if (!combo.ok) {
        refusals.push(`${model.name}: ${combo.refusals.join(' ')}`);
        continue;
      }
      const sizing = checkSizing({
        unit,
        equipmentType: unit.equipmentType,
        load: all,
        coolingDesignF: designF.cooling,
        heatingDesignF: designF.heating,
        policy,
      });
      const p = { model, unit, sizing, connected: combo.connectedPercent };
      if (sizing.withinRange) return p;
      if (best === null || sizingMiss(sizing) <= sizingMiss(best.sizing)) best = p;
    }
    return best;
  };
  /** Heads of these zones on multi-zone units: the fewest units all in range, else the plan closest to the ranges. */
  const multiPlan = (zones: readonly Draft[]): Plan | null => {
    if (zones.length < 2 || maxPorts < 2) return null;
    const chosenAll = zones.map((z) => pick(z, (k) => headsOf(multiHeads.filter((m) => kindOf(m) === k))));
    const chosenOf = new Map<Draft, Chosen<IndoorUnit>>();
    zones.forEach((z, i) => {
      const h = chosenAll[i];
      if (h) chosenOf.set(z, h);
    });
    if (chosenOf.size < zones.length) return null;
    let found: Plan | null = null;
    for (let units = 1; units <= Math.floor(zones.length / 2); units += 1) {
      const per = Math.ceil(zones.length / units);
      const ways = [
        groupByCapacity(zones, coolingOf, units, maxPorts),
        Array.from({ length: units }, (_, g) => zones.slice(g * per, (g + 1) * per)),
      ];
      for (const groups of ways) {
        // One group of every zone is tried even past the ports, so the refusal says why no single unit takes them.
        if (groups.length !== units || (units > 1 && groups.some((g) => g.length < 2 || g.length > maxPorts))) continue;
        const parts: Plan[] = [];
        for (const [gi, g] of groups.entries()) {
          const hs = g.flatMap((z) => {
            const h = chosenOf.get(z);
            return h ? [h] : [];
          });
          const o = multiFor(g, hs);
          if (!o) break;
          const plan = emptyPlan();
          const key = token();
          const who = units === 1 ? 'the whole home' : g.map((z) => z.name).join(', ');
          g.forEach((z, i) => {
            const h = hs[i];
            if (!h) return;
            plan.reasons.push(
              reason(`suggest:${z.key}`, z.name, h, `${smallestOr(h, kindOf(h.model) ?? 'head')} for this zone`),
            );
            if (!h.sizing.withinRange) plan.warnings.push(outOfRange('head', z.name, h));
            plan.zones.push(zoneInput(z, h.model.key));
            plan.sizings.push(h.sizing);
            if (kindOf(h.model) !== suits(z)) plan.unsuited += 1;
          });
          plan.reasons.push(
            reason(
              `suggest:outdoor:${key}`,
              who,
              o,
              `the smallest multi-zone unit whose ports take these heads (${o.connected} % connected) and that meets their rooms' coincident load${units > 1 ? `; one unit of ${units}, the heads spread so each unit carries a similar load` : ''}`,
            ),
          );
          if (!o.sizing.withinRange) plan.warnings.push(outOfRange('multi-zone unit that takes these heads', who, o));
          plan.systems.push({
            key,
            name: (units === 1 ? 'Multi-zone system' : `Multi-zone system ${gi + 1}`).slice(0, 80),
            outdoorUnitKey: o.model.key,
            circuits: g.map((z) => circuit(z.key)),
            electrical,
          });
          plan.sizings.push(o.sizing);
          plan.costCents = costOf(o.model.key, ...hs.map((h) => h.model.key));
          parts.push(plan);
        }
        if (parts.length === units) found = better(found, joinPlans(parts));
      }
      if (found && score(found).blockers === 0 && score(found).outOfRange === 0) break;
    }
    return found;
  };
  /** Each zone on its own single-zone pair (the head and the outdoor unit it is rated with); null when one has none. */
  const pairsPlan = (zones: readonly Draft[]): Plan | null => {
    const parts: Plan[] = [];
    for (const z of zones) {
      const candidatesOf = (kind: HeadKind) =>
        headsOf(heads.filter((m) => pairOf(m) !== undefined && kindOf(m) === kind)).flatMap((h) => {
          const o = pairOf(h.model);
          const unit = o ? outdoorByKey.get(o.key) : undefined;
          return o && unit ? [{ model: o, unit, head: h.model }] : [];
        });
      const p = pick(z, candidatesOf);
      const chosenHead = p ? pairHead(p, candidatesOf, suits(z)) : undefined;
      if (!p || !chosenHead) return null;
      const plan = emptyPlan();
      if (!p.sizing.withinRange) plan.warnings.push(outOfRange('single-zone pair', z.name, p));
      plan.reasons.push(
        reason(`suggest:${z.key}`, z.name, p, `${smallestOr(p, 'single-zone pair')}, with ${chosenHead.name}`),
      );
      plan.zones.push(zoneInput(z, chosenHead.key));
      plan.systems.push({
        key: token(),
        name: `${z.name} system`.slice(0, 80),
        outdoorUnitKey: p.model.key,
        circuits: [circuit(z.key)],
        electrical,
      });
      plan.sizings.push(p.sizing, p.sizing);
      if (kindOf(chosenHead) !== suits(z)) plan.unsuited += 1;
      plan.costCents = costOf(p.model.key, chosenHead.key);
      parts.push(plan);
    }
    return joinPlans(parts);
  };
  const ductlessPlan = (zones: readonly Draft[]): Plan | null => {
    if (zones.length === 0) return emptyPlan();
    refusals.length = 0;
    const multi = multiPlan(zones);
    const pairs = pairsPlan(zones);
    const plan = better(multi, pairs);
    if (plan && plan === pairs && multi === null && refusals.length > 0)
      plan.warnings.push(
        `No multi-zone unit takes these heads: ${[...new Set(refusals)].join('; ')} So each zone gets its own pair.`,
      );
    return plan;
  };
  /** Zones that go ducted (too big for any head, or closed rooms on the home's ducts when that comes closer) and the rest ductless. */
  const servePlan = (zones: readonly Draft[]): Plan | null => {
    const parts: Plan[] = [];
    const rest: Draft[] = [];
    for (const z of zones) {
      const tooBig = coolingOf(z) > largestHead * 1.3;
      const ductable = closedRooms(z) && z.roomIds.every((id) => ductRooms.includes(id));
      const d = tooBig || ductable ? ductedPlan(z) : null;
      if (d) {
        // A head of the kind the zone suits, on its own, against the ducted pair: the closer to its range serves it.
        const kind = suits(z);
        const head = size(headsOf(heads.filter((m) => kindOf(m) === kind)), z.load);
        if (tooBig || !head || sizingMiss(head.sizing) >= sizingMiss(d.sizings[0] ?? head.sizing)) {
          parts.push(d);
          continue;
        }
      }
      rest.push(z);
    }
    const ductless = ductlessPlan(rest);
    return ductless ? joinPlans([...parts, ductless]) : null;
  };

  /**
   * Rooms into ductless zones: one per room, except rooms too small for any head in range (the smallest head that
   * suits them is oversized), which share a slim ducted head with other small rooms of their floor — largest first,
   * a group closing once a ducted head is in range for it, a leftover joining the last group when that stays in range.
   */
  const roomZones = (roomIds: readonly string[], prefix: string, on: HomeLoad): Draft[] => {
    const ducted = headsOf(heads.filter((m) => kindOf(m) === 'ducted'));
    const inRange = (ids: readonly string[]) => size(ducted, loadOf(on, ids))?.sizing.withinRange === true;
    const floors = new Map<number, string[]>();
    for (const id of roomIds) {
      const f = roomsById.get(id)?.floorLevel ?? 1;
      floors.set(f, [...(floors.get(f) ?? []), id]);
    }
    const groups: string[][] = [];
    for (const f of [...floors.keys()].sort((a, b) => a - b)) {
      const small: string[] = [];
      for (const id of floors.get(f) ?? []) {
        const z = draft('x', [id], on);
        const h = pick(z, (k) => headsOf(heads.filter((m) => kindOf(m) === k)));
        const over =
          h !== null && !h.sizing.withinRange && (h.sizing.coolingRatio ?? 0) * 100 > h.sizing.allowedPercent.max;
        if (over && ducted.length > 0) small.push(id);
        else groups.push([id]);
      }
      small.sort((a, b) => coolingOf(draft('x', [b], on)) - coolingOf(draft('x', [a], on)));
      const closed: string[][] = [];
      let open: string[] = [];
      for (const id of small) {
        open.push(id);
        if (inRange(open)) {
          closed.push(open);
          open = [];
        }
      }
      const last = closed[closed.length - 1];
      if (open.length > 0 && last && inRange([...last, ...open])) last.push(...open);
      else if (open.length > 0) closed.push(open);
      groups.push(...closed);
    }
    groups.sort((a, b) => (roomOrder.get(a[0] ?? '') ?? 0) - (roomOrder.get(b[0] ?? '') ?? 0));
    return groups.map((ids, i) =>
      draft(
        `${prefix}${i + 1}`,
        ids.sort((a, b) => (roomOrder.get(a) ?? 0) - (roomOrder.get(b) ?? 0)),
        on,
      ),
    );
  };

  /**
   * The loads the desk will size this plan on: designLoads on the plan's design (the home of homeForDesign — a
   * ductless plan without the walk-through's ducts, a ducted unit with the ducts of the rooms it serves).
   */
  const deskLoads = (p: Plan): HomeLoad => {
    try {
      return designLoads({
        home,
        design: parseOrThrow(designSchema, { zones: p.zones, systems: p.systems }),
        indoorUnits: parsedIndoor,
        loads: walked,
        loadsOf,
      }).loads;
    } catch {
      return walked;
    }
  };
  /**
   * A candidate plan sized on the loads the desk will show for it. Its zones are drafted on the walk-through's loads
   * and served; while the desk's loads for the plan served (deskLoads) differ from those it was sized on — a ductless
   * plan leaves the ducts out, which can make a room too small for its head or large enough for one — the zones are
   * drafted again on the desk's loads and served again. Past SETTLE_BUILDS builds the zones of the last build are
   * kept and only their units chosen again on its desk loads (a room that moves between its own head and a shared
   * ducted head as its duct loads come and go stops moving). `settled` false: the last plan's loads still differ
   * from the desk's; the caller says so.
   */
  const settle = (
    zonesOn: (on: HomeLoad) => Draft[],
    serve: (zones: readonly Draft[]) => Plan | null,
  ): { plan: Plan; settled: boolean } | null => {
    let on = walked;
    let zones = zonesOn(on);
    let plan = serve(zones);
    for (let i = 1; plan !== null && i < 2 * SETTLE_BUILDS; i += 1) {
      const desk = deskLoads(plan);
      if (desk === on) return { plan, settled: true };
      on = desk;
      zones = i < SETTLE_BUILDS ? zonesOn(on) : zones.map((z) => draft(z.key, z.roomIds, on, z.given, z.name));
      plan = serve(zones);
    }
    return plan && { plan, settled: deskLoads(plan) === on };
  };

  const candidates: { label: string; plan: Plan }[] = [];
  const consider = (label: string, found: { plan: Plan; settled: boolean } | null, notes: readonly string[] = []) => {
    if (!found) return;
    found.plan.warnings.push(...notes);
    if (!found.settled)
      found.plan.warnings.push(
        `${label}: its units were sized on loads that differ from the desk's for this plan (its rooms' duct loads change with the kind of unit chosen), so check each unit's verdict on the desk.`,
      );
    candidates.push({ label, plan: found.plan });
  };
  if (givenZones) {
    // A zone of closed rooms with no ducted unit in the catalog to serve it is split into its rooms.
    const anyDucted = heads.some((m) => kindOf(m) === 'ducted') || ductedCandidates.length > 0;
    const notes: string[] = [];
    for (const g of givenZones)
      if (g.roomIds.length > 1 && g.openSpace !== true && !anyDucted)
        notes.push(
          `${g.name}: its rooms are not marked as one open space and the active catalog has no ducted unit, so each room gets its own head (a ductless head's air does not reach a closed room).`,
        );
    const zonesOn = (on: HomeLoad) =>
      givenZones.flatMap((g) => {
        const z = draft(g.key, [...g.roomIds], on, g);
        return closedRooms(z) && !anyDucted ? z.roomIds.map((id, i) => draft(`${g.key}-${i + 1}`, [id], on)) : [z];
      });
    consider('The zones as given', settle(zonesOn, servePlan), notes);
  } else {
    const all = home.rooms.map((r) => r.id);
    if (ductRooms.length > 0) {
      const rest = all.filter((id) => !ductRooms.includes(id));
      consider(
        ductRooms.length === all.length
          ? "A ducted heat pump on the home's ducts"
          : "A ducted heat pump on the home's ducts, ductless heads for the other rooms",
        settle(
          (on) => [draft('zd', ductRooms, on, undefined, 'Ducted rooms'), ...roomZones(rest, 'z', on)],
          ([zd, ...others]) => {
            const d = zd ? ductedPlan(zd) : null;
            const served = servePlan(others);
            return d && served ? joinPlans([d, served]) : null;
          },
        ),
      );
    }
    consider(
      'Ductless, a head for each room (small rooms sharing a ducted head)',
      settle((on) => roomZones(all, 'z', on), servePlan),
    );
  }
  let chosen: { label: string; plan: Plan } | null = null;
  for (const c of candidates) if (chosen === null || compareScores(score(c.plan), score(chosen.plan)) < 0) chosen = c;
  if (!chosen)
    return {
      design: { zones: [], systems: [] },
      reasons: [],
      warnings: ['No unit of the active catalog serves these rooms: add indoor and outdoor models to the catalog.'],
    };
  const plan = chosen.plan;
  // System keys s1, s2… in order (each plan marked its systems, and their reasons, with a placeholder token).
  const keyOf = new Map(plan.systems.map((s, i) => [s.key, `s${i + 1}`]));
  const systems = plan.systems.map((s) => ({ ...s, key: keyOf.get(s.key) ?? s.key }));
  const reasons = plan.reasons.map((r) => {
    const t = [...keyOf.keys()].find((k) => r.key.includes(k));
    return t === undefined ? r : { ...r, key: r.key.replace(t, keyOf.get(t) ?? t) };
  });
  if (candidates.length > 1) {
    const words = (c: { label: string; plan: Plan }) => {
      const sc = score(c.plan);
      const units = c.plan.sizings.length;
      const blocked =
        sc.blockers === 0
          ? ''
          : Number.isFinite(sc.blockers)
            ? `, ${sc.blockers} problem${sc.blockers === 1 ? '' : 's'} that would stop the ready mark (A2L room size, line limits or combinations)`
            : ', not a valid design';
      return `${c.label}: ${sc.outOfRange === 0 ? `all ${units} sizing checks in range` : `${sc.outOfRange} of ${units} sizing checks outside their range (${formatNumber(sc.missPoints, 1, { trim: true })} points in all)`}${blocked}`;
    };
    reasons.unshift(
      explanation({
        key: 'suggest:compared',
        label: 'Plans compared',
        value: candidates.length,
        unit: '',
        valueText: chosen.label,
        text: `${candidates.map(words).join('; ')}. Chosen: ${chosen.label} — the fewest problems that would stop the ready mark, then the fewest units outside their range, then the fewest points outside, then the kind of head that suits each zone, then the lower equipment cost.`,
        status: score(plan).blockers === 0 && score(plan).outOfRange === 0 ? 'ok' : 'warning',
        source: 'Active catalog, company sizing policy',
      }),
    );
  }
  const warnings = [...plan.warnings];
  for (const z of plan.zones) {
    const t = active.find((m) => m.key === z.indoorUnitKey)?.indoorType;
    if ((t === 'slim-ducted' || t === 'air-handler') && z.lowestDuctOpeningFt === undefined)
      warnings.push(
        `Enter the height of the lowest duct opening for ${z.name}: until then the A2L room-size check takes 0.6 m, the least the standard allows.`,
      );
  }
  return { design: { zones: plan.zones, systems }, reasons, warnings };
}

/** The head of the chosen pair: of the kind that suits the zone when the pair has one, else a wall head. */
function pairHead(
  p: Chosen<OutdoorUnit>,
  candidatesOf: (kind: HeadKind) => readonly { model: CatalogModel; head: CatalogModel }[],
  kind: HeadKind,
): CatalogModel | undefined {
  for (const k of [kind, 'wall'] as const) {
    const c = candidatesOf(k).find((x) => x.model.key === p.model.key);
    if (c) return c.head;
  }
  return undefined;
}
