import { designCatalogFromModels, equipmentTypeOf } from '../catalog/design-bridge';
import type { CatalogModel } from '../catalog/model';
import { explanation, type Explanation } from '../explain/explanation';
import { formatPercent, formatQuantity } from '../explain/format';
import { coincidentLoad, homeLoadFromParsed, type HomeLoad } from '../loads/home-load';
import { parseOrThrow } from '../parse';
import type { DesignInput } from '../schemas/design';
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

/** The smallest candidate within the sizing range, else the smallest that covers the load, else the largest. */
function choose<U extends IndoorUnit | OutdoorUnit>(
  candidates: readonly { model: CatalogModel; unit: U }[],
  load: LoadToMeet,
  designF: { cooling: number; heating: number },
  policy: SizingPolicy,
): Chosen<U> | null {
  let covering: Chosen<U> | null = null;
  let last: Chosen<U> | null = null;
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
    if (covering === null && (sizing.coolingRatio ?? 0) * 100 >= sizing.allowedPercent.min) covering = p;
    last = p;
  }
  return covering ?? last;
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

/**
 * Suggests equipment from the active catalog for a home (issue 13, "suggest"): zones by the grouping
 * rule above (or the ones given), for each zone the smallest active head within the sizing range at
 * the job's design temperatures; then one multi-zone outdoor unit for all zones when one fits (ports,
 * port sizes, connected %, sizing on the coincident load of every room) — the smallest such — else a
 * single-zone pair per zone. Candidates are ordered by nominal size, cost, then key, so the same
 * inputs always give the same suggestion. Runs default to SUGGEST_LINE_FT.
 */
export function suggestDesign({
  home: homeIn,
  models,
  policy = DEFAULT_SIZING_POLICY,
  zones: givenZones,
  lineLengthFt = SUGGEST_LINE_FT,
}: {
  readonly home: HomeInput;
  readonly models: readonly CatalogModel[];
  readonly policy?: SizingPolicy;
  readonly zones?: readonly { readonly key: string; readonly name: string; readonly roomIds: readonly string[] }[];
  readonly lineLengthFt?: number;
}): Suggestion {
  const home = parseOrThrow(homeInputSchema, homeIn);
  const loads = homeLoadFromParsed(home);
  const dc = home.designConditions;
  const designF = { cooling: dc.outdoorCoolingDryBulbF, heating: dc.outdoorHeatingDryBulbF };
  const active = models.filter((m) => m.active).sort(byNominal);
  const engine = designCatalogFromModels(active);
  const indoorByKey = new Map(engine.indoorUnits.map((u) => [u.key, u]));
  const outdoorByKey = new Map(engine.outdoorUnits.map((u) => [u.key, u]));
  const pairOf = (m: CatalogModel) =>
    m.matchedKeys.map((k) => active.find((o) => o.key === k)).find((o) => o?.kind === 'outdoor-single-zone');
  const walls = active.filter((m) => m.kind === 'indoor' && (m.indoorType === 'wall' || m.indoorType === undefined));
  const multiHeads = walls.filter((m) => pairOf(m) === undefined);
  const headsOf = (list: CatalogModel[]) =>
    list.flatMap((m) => {
      const unit = indoorByKey.get(m.key);
      return unit ? [{ model: m, unit }] : [];
    });
  const smallest = headsOf(multiHeads)[0] ?? headsOf(walls)[0];
  const minZone = smallest ? (smallest.model.minCoolingBtuh ?? smallest.unit.nominalBtuh * HEAD_TURNDOWN) : 0;
  const zones: ZoneDraft[] = givenZones
    ? givenZones.map((z) => ({ key: z.key, name: z.name, roomIds: [...z.roomIds], load: loadOf(loads, z.roomIds) }))
    : groupRooms(loads, home, minZone);
  const reasons: Explanation[] = [];
  const warnings: string[] = [];
  const electrical = { circuitLengthFt: 30 };
  const circuit = (zoneKey: string) => ({ zoneKey, lengthFt: lineLengthFt });
  // Multi-zone: heads for each zone, then the smallest outdoor unit that takes them and meets the whole load.
  if (zones.length > 1) {
    const heads = zones.map((z) => choose(headsOf(multiHeads), z.load, designF, policy));
    const all = loadOf(
      loads,
      zones.flatMap((z) => z.roomIds),
    );
    const outdoors = active.filter((m) => m.kind === 'outdoor-multi-zone' && (m.ports ?? 0) >= zones.length);
    for (const m of outdoors) {
      const unit = outdoorByKey.get(m.key);
      if (!unit || heads.some((h) => h === null)) continue;
      const combo = checkCombination({ outdoor: unit, indoor: heads.flatMap((h) => (h ? [h.unit] : [])) });
      if (!combo.ok) continue;
      const sizing = checkSizing({
        unit,
        equipmentType: unit.equipmentType,
        load: all,
        coolingDesignF: designF.cooling,
        heatingDesignF: designF.heating,
        policy,
      });
      if ((sizing.coolingRatio ?? 0) * 100 < sizing.allowedPercent.min) continue;
      zones.forEach((z, i) => {
        const h = heads[i];
        if (h) reasons.push(reason(`suggest:${z.key}`, z.name, h, 'the smallest head in range'));
        if (h && !h.sizing.withinRange)
          warnings.push(`No head fits ${z.name} inside the sizing range; ${h.model.name} is the closest.`);
      });
      reasons.push(
        reason(
          'suggest:outdoor',
          'the whole home',
          { model: m, unit, sizing },
          `the smallest multi-zone unit whose ports take these heads (${combo.connectedPercent} % connected) and that meets the home's coincident load`,
        ),
      );
      return {
        design: {
          zones: zones.map((z, i) => ({
            key: z.key,
            name: z.name,
            roomIds: z.roomIds,
            indoorUnitKey: heads[i]?.model.key ?? '',
          })),
          systems: [
            {
              key: 's1',
              name: 'Multi-zone system',
              outdoorUnitKey: m.key,
              circuits: zones.map((z) => circuit(z.key)),
              electrical,
            },
          ],
        },
        reasons,
        warnings,
      };
    }
  }
  // Single-zone pairs: the head and the outdoor unit it is rated with, the smallest pair in range.
  const pairs = headsOf(walls.filter((m) => pairOf(m) !== undefined));
  const dz: DesignInput['zones'] = [];
  const ds: DesignInput['systems'] = [];
  zones.forEach((z, i) => {
    const candidates = pairs.flatMap((h) => {
      const o = pairOf(h.model);
      const unit = o ? outdoorByKey.get(o.key) : undefined;
      return o && unit ? [{ model: o, unit, head: h.model }] : [];
    });
    const p = choose(candidates, z.load, designF, policy);
    const head = p ? candidates.find((c) => c.model.key === p.model.key)?.head : undefined;
    if (!p || !head) {
      warnings.push(`No single-zone pair in the active catalog for ${z.name}.`);
      return;
    }
    if (!p.sizing.withinRange)
      warnings.push(`No pair fits ${z.name} inside the sizing range; ${p.model.name} is the closest.`);
    reasons.push(reason(`suggest:${z.key}`, z.name, p, `the smallest single-zone pair in range, with ${head.name}`));
    dz.push({ key: z.key, name: z.name, roomIds: z.roomIds, indoorUnitKey: head.key });
    ds.push({
      key: `s${i + 1}`,
      name: `${z.name} system`.slice(0, 80),
      outdoorUnitKey: p.model.key,
      circuits: [circuit(z.key)],
      electrical,
    });
  });
  return { design: { zones: dz, systems: ds }, reasons, warnings };
}
