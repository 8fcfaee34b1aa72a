import { designCatalogFromModels, equipmentTypeOf } from '../catalog/design-bridge';
import type { CatalogModel } from '../catalog/model';
import { explanation, type Explanation } from '../explain/explanation';
import { formatPercent, formatQuantity } from '../explain/format';
import { coincidentLoad, homeLoadFromParsed, type HomeLoad } from '../loads/home-load';
import { parseOrThrow } from '../parse';
import type { CircuitInput, DesignInput } from '../schemas/design';
import { floorAreaFt2 } from '../geometry';
import type { IndoorUnit, OutdoorUnit } from '../schemas/equipment';
import { homeInputSchema, type HomeInput } from '../schemas/home';
import { checkCombination, checkSizing, type LoadToMeet, type SizingCheck } from '../sizing/match';
import { DEFAULT_SIZING_POLICY, type SizingPolicy } from '../sizing/policy';

/** A suggested design: the input computeDesign takes, with why each unit was chosen. */
export interface Suggestion {
  readonly design: DesignInput;
  readonly reasons: readonly Explanation[];
  /** Zones or loads no active unit fits within the sizing range (the estimator decides). */
  readonly warnings: readonly string[];
}

/** Default run per circuit until the estimator measures it, ft. [TRADE: a typical one-wall mini-split run] */
export const SUGGEST_LINE_FT = 25;

interface ZoneDraft {
  key: string;
  name: string;
  roomIds: string[];
  load: LoadToMeet;
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

/**
 * Rooms into zones: each room gets its own head, except a room whose coincident cooling load is
 * below `minZoneBtuh` — the smallest head's minimum output, where it would only cycle — which shares
 * the previous room's zone on its floor (the next one's when it comes first). [OWN: grouping rule —
 * common practice is a head in each main room, with small rooms (baths, halls) served by a neighbour's;
 * inverter heads turn down to about 30 % of nominal, common practice]
 */
function groupRooms(loads: HomeLoad, home: HomeInput, minZoneBtuh: number): ZoneDraft[] {
  const floors = new Map<number, string[]>();
  for (const r of home.rooms) {
    const f = r.floorLevel ?? 1;
    const list = floors.get(f) ?? [];
    list.push(r.id);
    floors.set(f, list);
  }
  const names = new Map(home.rooms.map((r) => [r.id, r.name]));
  const zones: ZoneDraft[] = [];
  for (const f of [...floors.keys()].sort((a, b) => a - b)) {
    const floorZones: string[][] = [];
    let waiting: string[] = [];
    for (const id of floors.get(f) ?? []) {
      const l = loadOf(loads, [id]);
      if (l.sensibleBtuh + l.latentBtuh >= minZoneBtuh) {
        floorZones.push([...waiting, id]);
        waiting = [];
      } else {
        const last = floorZones[floorZones.length - 1];
        if (last) last.push(id);
        else waiting.push(id);
      }
    }
    if (waiting.length > 0) floorZones.push(waiting);
    for (const ids of floorZones)
      zones.push({
        key: `z${zones.length + 1}`,
        name: ids
          .map((id) => names.get(id) ?? id)
          .join(' + ')
          .slice(0, 80),
        roomIds: ids,
        load: loadOf(loads, ids),
      });
  }
  return zones;
}

/** Smallest output a head turns down to when the catalog gives none, as a share of nominal. [TRADE: inverter turndown ≈ 30 %] */
export const HEAD_TURNDOWN = 0.3;

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

type HeadKind = 'ducted' | 'cassette' | 'wall';

/**
 * Suggests equipment from the active catalog for a home (issue 13, "suggest"):
 * - Ducted: when calc groups the rooms, those the home's ducts serve (house.ducts, all rooms when it
 *   names none); and any zone (given or not) no ductless head can meet, go on a ducted heat pump — the smallest in range on their coincident load —
 *   with the air handler it is matched with; when the heat pump falls short of the heat loss at the
 *   design temperature, the smallest matched heat kit that covers the shortfall.
 * - Ductless: zones by the grouping rule above (or the ones given). Each zone's head: a slim ducted
 *   unit for a zone of several closed rooms (a wall head's air does not reach a closed room — common
 *   practice), a ceiling cassette for one room of at least CASSETTE_MIN_FT2, else a wall head — the
 *   smallest of that kind in range, a wall head when none of the kind is. Then multi-zone outdoor
 *   units: one for all zones when one fits (ports, port sizes, connected %, sizing on the coincident
 *   load of its rooms) — the smallest such — else two, three… units over consecutive zones; else a
 *   single-zone pair per zone, with why no multi-zone unit took them.
 * Candidates are ordered by nominal size, cost, then key, so the same inputs always give the same
 * suggestion. A circuit the estimator already entered for a zone (`circuits`) is kept as entered; new
 * ones run SUGGEST_LINE_FT.
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
  const loads = homeLoadFromParsed(home);
  const dc = home.designConditions;
  const designF = { cooling: dc.outdoorCoolingDryBulbF, heating: dc.outdoorHeatingDryBulbF };
  const active = models.filter((m) => m.active).sort(byNominal);
  const engine = designCatalogFromModels(active);
  const indoorByKey = new Map(engine.indoorUnits.map((u) => [u.key, u]));
  const outdoorByKey = new Map(engine.outdoorUnits.map((u) => [u.key, u]));
  const roomsById = new Map(home.rooms.map((r) => [r.id, r]));
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
  const walls = heads.filter((m) => kindOf(m) === 'wall');
  const multiHeads = heads.filter((m) => pairOf(m) === undefined);
  const smallest = headsOf(walls.filter((m) => pairOf(m) === undefined))[0] ?? headsOf(walls)[0];
  const minZone = smallest ? (smallest.model.minCoolingBtuh ?? smallest.unit.nominalBtuh * HEAD_TURNDOWN) : 0;
  const reasons: Explanation[] = [];
  const warnings: string[] = [];
  const electrical = { circuitLengthFt: 30 };
  const enteredByZone = new Map(entered.map((c) => [c.zoneKey, c]));
  const circuit = (zoneKey: string): CircuitInput => enteredByZone.get(zoneKey) ?? { zoneKey, lengthFt: lineLengthFt };
  const zoneInput = (z: ZoneDraft & { given?: GivenZone }, indoorUnitKey: string): DesignInput['zones'][number] => ({
    key: z.key,
    name: z.name,
    roomIds: z.roomIds,
    indoorUnitKey,
    ...(z.given?.headRoomId !== undefined ? { headRoomId: z.given.headRoomId } : {}),
    ...(z.given?.openSpace !== undefined ? { openSpace: z.given.openSpace } : {}),
    ...(z.given?.lowestDuctOpeningFt !== undefined ? { lowestDuctOpeningFt: z.given.lowestDuctOpeningFt } : {}),
  });
  const dz: DesignInput['zones'] = [];
  const ds: DesignInput['systems'] = [];
  const systemKey = () => `s${ds.length + 1}`;
  /** The suggestion, saying which ducted zones still need their lowest duct opening for the A2L check. */
  const finish = (): Suggestion => {
    for (const z of dz) {
      const t = active.find((m) => m.key === z.indoorUnitKey)?.indoorType;
      if ((t === 'slim-ducted' || t === 'air-handler') && z.lowestDuctOpeningFt === undefined)
        warnings.push(
          `Enter the height of the lowest duct opening for ${z.name}: until then the A2L room-size check takes 0.6 m, the least the standard allows.`,
        );
    }
    return { design: { zones: dz, systems: ds }, reasons, warnings };
  };

  // The rooms a ducted system serves: the home's ducts (house.ducts), else none.
  const ductRooms = home.ducts ? (home.ducts.roomIds ?? home.rooms.map((r) => r.id)) : [];
  let zones: Array<ZoneDraft & { given?: GivenZone }> = givenZones
    ? givenZones.map((z) => ({
        key: z.key,
        name: z.name,
        roomIds: [...z.roomIds],
        load: loadOf(loads, z.roomIds),
        given: z,
      }))
    : groupRooms(loads, { ...home, rooms: home.rooms.filter((r) => !ductRooms.includes(r.id)) }, minZone);
  if (!givenZones && ductRooms.length > 0)
    zones = [
      {
        key: 'zd',
        name: 'Ducted rooms',
        roomIds: ductRooms.filter((id) => roomsById.has(id)),
        load: loadOf(loads, ductRooms),
      },
      ...zones,
    ];

  // Ducted heat pumps with their air handlers (and heat kits) for the ducted rooms and zones too big for any head.
  const largestHead = Math.max(0, ...headsOf(heads).map((h) => h.unit.nominalBtuh));
  const ductedOutdoors = active.filter((m) => m.kind === 'outdoor-ducted');
  const airHandlers = active.filter((m) => m.kind === 'indoor' && m.indoorType === 'air-handler');
  const ductedCandidates = ductedOutdoors.flatMap((o) => {
    const unit = outdoorByKey.get(o.key);
    const handler = airHandlers.find((a) => o.matchedKeys.includes(a.key) || a.matchedKeys.includes(o.key));
    return unit && handler ? [{ model: o, unit, handler }] : [];
  });
  /** The ducted heat pump for a zone (the smallest in range, else the closest) with its air handler. */
  const ductedChoice = (z: ZoneDraft) => {
    const p = choose(ductedCandidates, z.load, designF, policy);
    const handler = p ? ductedCandidates.find((c) => c.model.key === p.model.key)?.handler : undefined;
    const handlerUnit = handler ? indoorByKey.get(handler.key) : undefined;
    if (!p || !handler || !handlerUnit) return null;
    // The zone is sized on the matched pair (computeDesign's zoneRating): the heat pump with this air handler.
    return { p, handler, miss: sizingMiss(p.sizing) };
  };
  const ducted = (
    z: ZoneDraft & { given?: GivenZone },
    { p, handler }: NonNullable<ReturnType<typeof ductedChoice>>,
  ) => {
    if (!p.sizing.withinRange) warnings.push(outOfRange('ducted heat pump', z.name, p));
    const key = systemKey();
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
        reasons.push(
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
        warnings.push(
          `${p.model.name} falls ${btuh(shortfall)} short of the heat loss of ${z.name} at ${designF.heating} °F, and no heat kit in the catalog fits ${handler.name}.`,
        );
    }
    reasons.push(reason(`suggest:${z.key}`, z.name, p, `${smallestOr(p, 'ducted heat pump')}, with ${handler.name}`));
    dz.push(zoneInput(z, handler.key));
    ds.push({
      key,
      name: `${z.name} ducted system`.slice(0, 80),
      outdoorUnitKey: p.model.key,
      circuits: [circuit(z.key)],
      electrical,
      ...(heatKitKey ? { heatKitKey } : {}),
    });
  };
  zones = zones.filter((z) => {
    // Zones the estimator gave keep their grouping: only one too big for any head goes ducted when a ducted heat
    // pump is in range…
    const wantsDucts =
      (!givenZones && z.roomIds.every((id) => ductRooms.includes(id))) ||
      z.load.sensibleBtuh + z.load.latentBtuh > largestHead * 1.3;
    // …or several closed rooms the home's ducts serve, when no head is in range for them.
    const ductable =
      z.roomIds.length > 1 && z.given?.openSpace !== true && z.roomIds.every((id) => ductRooms.includes(id));
    if (!wantsDucts && !ductable) return true;
    const d = ductedChoice(z);
    if (!d) return true;
    if (wantsDucts && d.p.sizing.withinRange) {
      ducted(z, d);
      return false;
    }
    // No ducted system in range: it still serves the zone when no head comes closer to the range (the air handler's
    // sizing and the heat pump's, the farther of the two).
    const head = choose(headsOf(heads), z.load, designF, policy);
    if (head && sizingMiss(head.sizing) < d.miss) return true;
    if (head?.sizing.withinRange) return true;
    ducted(z, d);
    return false;
  });

  // Ductless: the kind of head that suits each zone, the smallest of it in range.
  const areaOf = (z: ZoneDraft) => z.roomIds.reduce((sum, id) => sum + floorAreaFt2(roomsById.get(id) ?? {}), 0);
  const suits = (z: ZoneDraft & { given?: GivenZone }): HeadKind =>
    z.roomIds.length > 1 && z.given?.openSpace !== true
      ? 'ducted'
      : areaOf(z) >= CASSETTE_MIN_FT2
        ? 'cassette'
        : 'wall';
  const pick = <U extends IndoorUnit | OutdoorUnit>(
    z: ZoneDraft & { given?: GivenZone },
    options: (kind: HeadKind) => readonly { model: CatalogModel; unit: U }[],
  ): Chosen<U> | null => {
    const kind = suits(z);
    const first = choose(options(kind), z.load, designF, policy);
    if (first?.sizing.withinRange || kind === 'wall') return first ?? choose(options('wall'), z.load, designF, policy);
    const wall = choose(options('wall'), z.load, designF, policy);
    // Neither in range: the one closer to it (the kind that suits the zone on a tie), never a far-off size of the
    // suited kind when a wall head comes closer.
    return wall?.sizing.withinRange ? wall : closer(first, wall);
  };
  const refusals: string[] = [];
  /** The smallest multi-zone unit for these zones' heads, or null (its refusals kept). */
  const multiFor = (group: typeof zones, chosen: Array<Chosen<IndoorUnit> | null>) => {
    if (chosen.some((h) => h === null)) return null;
    const all = loadOf(
      loads,
      group.flatMap((z) => z.roomIds),
    );
    // The smallest in range, else the closest to it (as choose).
    let best: { model: CatalogModel; unit: OutdoorUnit; sizing: SizingCheck; connected: number } | null = null;
    for (const m of active.filter((x) => x.kind === 'outdoor-multi-zone')) {
      const unit = outdoorByKey.get(m.key);
      if (!unit) continue;
      const combo = checkCombination({ outdoor: unit, indoor: chosen.flatMap((h) => (h ? [h.unit] : [])) });
      if (!combo.ok) {
        refusals.push(`${m.name}: ${combo.refusals.join(' ')}`);
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
      const p = { model: m, unit, sizing, connected: combo.connectedPercent };
      if (sizing.withinRange) return p;
      if (best === null || sizingMiss(sizing) <= sizingMiss(best.sizing)) best = p;
    }
    return best;
  };
  if (zones.length > 1) {
    const chosen = zones.map((z) => pick(z, (k) => headsOf(multiHeads.filter((m) => kindOf(m) === k))));
    // One unit for all, else two, three… over consecutive zones (each unit takes two zones or more): the fewest
    // units all in range, else the fewest that take the heads (each the closest to its range).
    type Out = NonNullable<ReturnType<typeof multiFor>>;
    let plan: { units: number; groups: (typeof zones)[]; outs: Out[] } | null = null;
    for (let units = 1; units <= Math.floor(zones.length / 2); units += 1) {
      const size = Math.ceil(zones.length / units);
      const groups = Array.from({ length: units }, (_, g) => zones.slice(g * size, (g + 1) * size));
      if (groups.some((g) => g.length < 2)) continue;
      const outs = groups.map((g) =>
        multiFor(
          g,
          g.map((z) => chosen[zones.indexOf(z)] ?? null),
        ),
      );
      if (outs.some((o) => o === null)) continue;
      const found = { units, groups, outs: outs.flatMap((o) => (o ? [o] : [])) };
      if (found.outs.every((o) => o.sizing.withinRange)) {
        plan = found;
        break;
      }
      plan ??= found;
    }
    if (plan) {
      const { units, groups, outs } = plan;
      groups.forEach((g, gi) => {
        const o = outs[gi];
        if (!o) return;
        const key = systemKey();
        const who = units === 1 ? 'the whole home' : g.map((z) => z.name).join(', ');
        for (const z of g) {
          const h = chosen[zones.indexOf(z)];
          if (!h) continue;
          reasons.push(
            reason(`suggest:${z.key}`, z.name, h, `${smallestOr(h, kindOf(h.model) ?? 'head')} for this zone`),
          );
          if (!h.sizing.withinRange) warnings.push(outOfRange('head', z.name, h));
          dz.push(zoneInput(z, h.model.key));
        }
        reasons.push(
          reason(
            `suggest:outdoor:${key}`,
            who,
            o,
            `the smallest multi-zone unit whose ports take these heads (${o.connected} % connected) and that meets their rooms' coincident load${units > 1 ? `; one unit of ${units}, as no single unit takes every head` : ''}`,
          ),
        );
        if (!o.sizing.withinRange) warnings.push(outOfRange('multi-zone unit that takes these heads', who, o));
        ds.push({
          key,
          name: (units === 1 ? 'Multi-zone system' : `Multi-zone system ${gi + 1}`).slice(0, 80),
          outdoorUnitKey: o.model.key,
          circuits: g.map((z) => circuit(z.key)),
          electrical,
        });
      });
      return finish();
    }
    if (refusals.length > 0)
      warnings.push(
        `No multi-zone unit takes these heads: ${[...new Set(refusals)].join('; ')} So each zone gets its own pair.`,
      );
  }
  // Single-zone pairs: the head and the outdoor unit it is rated with, the smallest pair in range.
  zones.forEach((z) => {
    const candidatesOf = (kind: HeadKind) =>
      headsOf(heads.filter((m) => pairOf(m) !== undefined && kindOf(m) === kind)).flatMap((h) => {
        const o = pairOf(h.model);
        const unit = o ? outdoorByKey.get(o.key) : undefined;
        return o && unit ? [{ model: o, unit, head: h.model }] : [];
      });
    const p = pick(z, candidatesOf);
    const chosenHead = p ? pairHead(p, candidatesOf, suits(z)) : undefined;
    if (!p || !chosenHead) {
      warnings.push(`No single-zone pair in the active catalog for ${z.name}.`);
      return;
    }
    if (!p.sizing.withinRange) warnings.push(outOfRange('single-zone pair', z.name, p));
    reasons.push(
      reason(`suggest:${z.key}`, z.name, p, `${smallestOr(p, 'single-zone pair')}, with ${chosenHead.name}`),
    );
    dz.push(zoneInput(z, chosenHead.key));
    ds.push({
      key: systemKey(),
      name: `${z.name} system`.slice(0, 80),
      outdoorUnitKey: p.model.key,
      circuits: [circuit(z.key)],
      electrical,
    });
  });
  return finish();
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
