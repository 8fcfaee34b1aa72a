import { CalcError } from '../errors';
import { electricalPlan, type ElectricalPlan } from '../electrical/plan';
import { m2FromFt2, mFromFt } from '../units';
import { coincidentLoad, type HomeLoad } from '../loads/home-load';
import { parseOrThrow } from '../parse';
import { priceLines, priceOption, type OptionPrice, type PricedLine } from '../pricing/price';
import {
  laborTableOf,
  priceBookSchema,
  pricingSchema,
  type PriceBook,
  type PriceBookInput,
  type Pricing,
  type PricingInput,
} from '../pricing/schemas';
import { CAUTIONS } from '../refrigerant/cautions';
import { refrigerantPlan, type CircuitToPlan, type RefrigerantPlan } from '../refrigerant/circuits';
import { designSchema, type Design, type DesignInput } from '../schemas/design';
import {
  equipmentCatalogSchema,
  type EquipmentCatalog,
  type EquipmentCatalogInput,
  isDuctedUnit,
  type IndoorUnit,
  type OutdoorUnit,
} from '../schemas/equipment';
import { homeInputSchema, type Home, type HomeInput } from '../schemas/home';
import { checkCombination, checkSizing, zoneRating, type CombinationCheck, type SizingCheck } from '../sizing/match';
import { DEFAULT_SIZING_POLICY, sizingPolicySchema, type SizingPolicy } from '../sizing/policy';
import { buildTakeoff, type SystemForTakeoff } from '../takeoff/build';
import { zoneLoads, type ZoneLoad } from './zone-loads';
import { designLoads, explainDuctLoads, walkThroughDucts, walkThroughDuctShares } from './design-ducts';
import { explanation, type Explanation } from '../explain/explanation';
import { formatQuantity } from '../explain/format';
import { explainExtension, explainLineSell, explainLineTax, explainOptionPrice } from '../pricing/explain-price';
import { technologyTransitionsCheck, type RefrigerantRuleCheck } from '../refrigerant/rules';
import { explainSizing, heatingBalance, type HeatingBalance } from './explain-sizing';
import type { HeatKit } from '../schemas/equipment';

/** Why a design cannot be marked "ready to propose": a maker's limit exceeded or a combination refused. */
export interface DesignBlocker {
  readonly code: 'limit-exceeded' | 'combination-refused';
  /** What kind of limit: line lengths and lift, A2L room size, refrigerant rule, electrical, ports and capacity. */
  readonly kind: 'lines' | 'a2l' | 'refrigerant-rule' | 'electrical' | 'combination' | 'connection';
  readonly systemKey: string | null;
  readonly message: string;
}

export interface ZoneResult {
  readonly zoneKey: string;
  readonly name: string;
  readonly roomIds: readonly string[];
  readonly indoorUnitKey: string;
  readonly sizing: SizingCheck;
  /** Load against capacity, sizing ratio with its verdict, latent check, heating coverage. */
  readonly explanations: readonly Explanation[];
}

export interface SystemResult {
  readonly systemKey: string;
  readonly name: string;
  readonly outdoorUnitKey: string;
  readonly sizing: SizingCheck;
  readonly combination: CombinationCheck;
  readonly refrigerant: RefrigerantPlan;
  readonly electrical: ElectricalPlan;
  /** Balance point and backup heat (heat pumps with heating data), else null. */
  readonly heating: HeatingBalance | null;
  readonly heatKitKey: string | null;
  /** The heat kit's own branch circuit, when one is chosen. */
  readonly heatKitElectrical: ElectricalPlan | null;
  readonly refrigerantRule: RefrigerantRuleCheck;
  /** Sizing, combination, charge, electrical: every number of this system with its why. */
  readonly explanations: readonly Explanation[];
}

export interface DesignResult {
  readonly loads: HomeLoad;
  readonly zones: readonly ZoneResult[];
  readonly systems: readonly SystemResult[];
  readonly takeoff: readonly PricedLine[];
  readonly price: OptionPrice;
  readonly warnings: readonly string[];
  /** Limits exceeded and refused combinations: the design cannot be marked ready while any is listed. */
  readonly blockers: readonly DesignBlocker[];
  /** Takeoff lines and price, each with its why (systems and zones carry their own). */
  readonly explanations: readonly Explanation[];
  readonly cautions: readonly string[];
  readonly isEstimate: true;
}

export interface DesignRequest {
  readonly home: HomeInput;
  readonly design: DesignInput;
  readonly catalog: EquipmentCatalogInput;
  readonly priceBook: PriceBookInput;
  readonly pricing: PricingInput;
  readonly policy?: SizingPolicy;
}

function lookup<T>(
  map: ReadonlyMap<string, T>,
  k: string,
  code: 'UNKNOWN_EQUIPMENT' | 'UNKNOWN_ROOM' | 'UNKNOWN_ZONE',
  path: (string | number)[],
): T {
  const v = map.get(k);
  if (v === undefined) throw new CalcError(code, [{ path, message: `"${k}" was not found` }]);
  return v;
}

/** A Map from key to item, built with a plain loop (no [key, value] pair per item). */
function byKey<T>(items: readonly T[], key: (item: T) => string): Map<string, T> {
  const map = new Map<string, T>();
  for (const item of items) map.set(key(item), item);
  return map;
}

/**
 * The space an A2L leak from this zone's indoor unit spreads over [IEC 60335-2-40:2018 Annex GG, reference §11]:
 * a ducted unit → every room its ducts serve, with h0 the lowest duct opening (≥ 0.6 m; absent → 0.6 m);
 * a ductless head → the room it is installed in, or all the zone's rooms when the zone says they are one open space.
 */
function a2lSpace(
  zone: Design['zones'][number],
  indoor: IndoorUnit,
  load: ZoneLoad,
): Omit<CircuitToPlan, 'circuit' | 'indoor'> {
  if (isDuctedUnit(indoor))
    return {
      roomAreaM2: m2FromFt2({ ft2: load.servedAreaFt2 }),
      space: {
        basis: 'served-rooms',
        roomNames: load.servedRoomNames,
        ...(zone.lowestDuctOpeningFt === undefined ? {} : { h0M: mFromFt({ ft: zone.lowestDuctOpeningFt }) }),
      },
    };
  if (zone.openSpace === true)
    return {
      roomAreaM2: m2FromFt2({ ft2: load.servedAreaFt2 }),
      space: { basis: 'open-space', roomNames: load.servedRoomNames },
    };
  return {
    roomAreaM2: m2FromFt2({ ft2: load.headRoomAreaFt2 }),
    space: { basis: 'head-room', roomNames: load.headRoomName === '' ? [] : [load.headRoomName] },
  };
}

/**
 * A heat kit is installed in an air handler its catalog row lists (any air handler when it lists none): a system
 * without one — wall or slim ducted heads only, or another handler — refuses it with the combination's refusals.
 */
function withHeatKitFit(
  combination: CombinationCheck,
  kit: HeatKit | undefined,
  indoor: readonly IndoorUnit[],
  outdoorKey: string,
  systemName: string,
): CombinationCheck {
  if (!kit) return combination;
  const listed = (key: string) => kit.fitsModelKeys === undefined || kit.fitsModelKeys.includes(key);
  const fits = indoor.some((u) => u.unitType === 'ducted-air-handler' && (listed(u.key) || listed(outdoorKey)));
  if (fits) return combination;
  const models = kit.fitsModelKeys === undefined ? '' : ` it is listed for (${kit.fitsModelKeys.join(', ')})`;
  const refusal = `${kit.key} (${kit.description}) is installed in an air handler${models}: ${systemName} has none.`;
  return {
    ...combination,
    ok: false,
    refusals: [...combination.refusals, refusal],
    warnings: [...combination.warnings, refusal],
    explanation: {
      ...combination.explanation,
      status: 'blocker',
      verdict: [combination.ok ? '' : (combination.explanation.verdict ?? ''), refusal].filter((x) => x).join(' '),
    },
  };
}

/** The heat kit's run from the panel to the air handler, not entered: what is assumed instead, in plain words. */
export const heatKitRunAssumed = (outdoorRunFt: number): string =>
  `Panel to air handler not entered: the heat kit's circuit is taken as ${formatQuantity(outdoorRunFt, 'ft', 1)}, the outdoor unit's run. Enter the run from the panel to the air handler for the heat kit's wire, voltage drop and labor.`;

/**
 * The full recompute behind the screens: loads → zone and system sizing → refrigerant per
 * circuit → electrical → takeoff → priced option. Validates every input with its schema
 * (CalcError INVALID_INPUT / UNKNOWN_* with paths). Pure and deterministic.
 */
export function computeDesign(req: DesignRequest): DesignResult {
  return computeDesignFromParsed({
    home: parseOrThrow(homeInputSchema, req.home),
    design: parseOrThrow(designSchema, req.design),
    catalog: parseOrThrow(equipmentCatalogSchema, req.catalog),
    priceBook: parseOrThrow(priceBookSchema, req.priceBook),
    pricing: parseOrThrow(pricingSchema, req.pricing),
    policy: parseOrThrow(sizingPolicySchema, req.policy ?? DEFAULT_SIZING_POLICY),
  });
}

/** Already-validated inputs (schema outputs), e.g. from a form that parsed them as the user typed. */
export interface ParsedDesignRequest {
  readonly home: Home;
  readonly design: Design;
  readonly catalog: EquipmentCatalog;
  readonly priceBook: PriceBook;
  readonly pricing: Pricing;
  readonly policy: SizingPolicy;
  /** The home's loads when the caller already has them (several options on one home): skips the recompute. */
  readonly loads?: HomeLoad;
  /** How to work the loads of a home this design changes (its ducts): a caller trying many designs keeps them. */
  readonly loadsOf?: (home: Home) => HomeLoad;
  /**
   * false: leave out the takeoff lines' and the price's explanations (`explanations` is empty), for a caller
   * that prices the takeoff again after its own edits and explains that price itself (the server's desk).
   */
  readonly explainPrice?: boolean;
}

/**
 * The engine behind computeDesign without the schema pass: for callers holding schema
 * outputs (the client re-runs this on every keystroke after its form parsed the change).
 * Still throws UNKNOWN_* for dangling references.
 */
export function computeDesignFromParsed({
  home,
  design,
  catalog,
  priceBook,
  pricing,
  policy,
  loads: given,
  loadsOf,
  explainPrice = true,
}: ParsedDesignRequest): DesignResult {
  // A ducted system's ducts are this option's own: its loads are worked with them (the shared loads stand otherwise).
  // The walk-through's ducts count only for the rooms a ducted unit of this option serves (none: no duct loads).
  const indoorUnits = byKey(catalog.indoorUnits, (u) => u.key);
  const withDucts = designLoads({
    home,
    design,
    indoorUnits,
    ...(given ? { loads: given } : {}),
    ...(loadsOf ? { loadsOf } : {}),
  });
  const loads = withDucts.loads;
  // Several ducted systems on the walk-through's one set of ducts: each explains its own rooms' share of them.
  const shares = walkThroughDuctShares({ home, design, loads, ductedZone: withDucts.ductedZone });
  /** A ducted system's duct loads (none for a system without ducts on this option), with its share when shared. */
  const ductsOfSystem = (key: string) => {
    const share = shares?.get(key);
    const at = share ? 0 : withDucts.systemKeys.indexOf(key);
    const d = at >= 0 ? loads.ductSystems[at] : undefined;
    return d ? [{ d, share }] : [];
  };
  const dc = home.designConditions;
  const outdoorUnits = byKey(catalog.outdoorUnits, (u) => u.key);
  const zoneByKey = byKey(design.zones, (z) => z.key);
  const perZone = zoneLoads({ loads, zones: design.zones, roomsById: byKey(home.rooms, (r) => r.id) });
  const warnings: string[] = [];
  const systemOfZone = new Map<string, OutdoorUnit>();
  /** How many indoor units the system of each zone carries (a one-to-one system is sized as its matched pair). */
  const circuitsOfZone = new Map<string, number>();
  /** The heat kit of each zone's system, when it has one (the backup heat below the balance point). */
  const zoneKit = new Map<string, HeatKit>();
  const outdoorOfSystem = design.systems.map((s, si) => {
    const outdoor = lookup(outdoorUnits, s.outdoorUnitKey, 'UNKNOWN_EQUIPMENT', ['systems', si, 'outdoorUnitKey']);
    s.circuits.forEach((c, ci) => {
      lookup(zoneByKey, c.zoneKey, 'UNKNOWN_ZONE', ['systems', si, 'circuits', ci, 'zoneKey']);
      systemOfZone.set(c.zoneKey, outdoor);
      circuitsOfZone.set(c.zoneKey, s.circuits.length);
      const kit = s.heatKitKey === undefined ? undefined : catalog.heatKits?.find((k) => k.key === s.heatKitKey);
      if (kit) zoneKit.set(c.zoneKey, kit);
    });
    return outdoor;
  });
  const zones: ZoneResult[] = design.zones.map((z, zi) => {
    const indoor = lookup(indoorUnits, z.indoorUnitKey, 'UNKNOWN_EQUIPMENT', ['zones', zi, 'indoorUnitKey']);
    const load = lookup(perZone, z.key, 'UNKNOWN_ROOM', ['zones', zi, 'roomIds']);
    const outdoor = systemOfZone.get(z.key);
    if (!outdoor) warnings.push(`Zone ${z.name} is not connected to any outdoor unit.`);
    // A one-to-one system (single-zone pair, ducted heat pump with its air handler) is sized on the pair's rating.
    const rated = zoneRating({ indoor, outdoor, indoorUnitsOnSystem: circuitsOfZone.get(z.key) ?? 0 });
    const sizing = checkSizing({
      unit: rated.unit,
      equipmentType: outdoor?.equipmentType ?? 'heat-pump-variable-speed',
      load,
      coolingDesignF: dc.outdoorCoolingDryBulbF,
      heatingDesignF: dc.outdoorHeatingDryBulbF,
      policy,
    });
    const explanations = explainSizing({
      keyPrefix: `zone:${z.key}:`,
      who: z.name,
      sizing,
      cooling: rated.unit.cooling,
      heating: rated.unit.heating,
      ratedAs: rated.matched ? rated.unit.description : undefined,
      equipmentType: outdoor?.equipmentType ?? 'heat-pump-variable-speed',
      coolingDesignF: dc.outdoorCoolingDryBulbF,
      heatingDesignF: dc.outdoorHeatingDryBulbF,
      sensibleHeatRatio: rated.unit.sensibleHeatRatio,
      sensibleLoadBtuh: load.sensibleBtuh,
      latentLoadBtuh: load.latentBtuh,
      backupHeat: zoneKit.get(z.key),
    });
    return { zoneKey: z.key, name: z.name, roomIds: z.roomIds, indoorUnitKey: indoor.key, sizing, explanations };
  });
  const heatKits = byKey<HeatKit>(catalog.heatKits ?? [], (k) => k.key);
  const blockers: DesignBlocker[] = [];
  for (const z of design.zones)
    if (!systemOfZone.has(z.key))
      blockers.push({
        code: 'combination-refused',
        kind: 'connection',
        systemKey: null,
        message: `Zone ${z.name} is not connected to any outdoor unit.`,
      });
  const forTakeoff: SystemForTakeoff[] = [];
  const systems: SystemResult[] = design.systems.map((s, si) => {
    const outdoor = outdoorOfSystem[si] ?? lookup(outdoorUnits, s.outdoorUnitKey, 'UNKNOWN_EQUIPMENT', []);
    const indoorByZone = new Map<string, IndoorUnit>();
    const servedRooms: string[] = [];
    const circuits = s.circuits.map((c) => {
      const zone = lookup(zoneByKey, c.zoneKey, 'UNKNOWN_ZONE', []);
      const indoor = lookup(indoorUnits, zone.indoorUnitKey, 'UNKNOWN_EQUIPMENT', []);
      indoorByZone.set(c.zoneKey, indoor);
      const load = lookup(perZone, c.zoneKey, 'UNKNOWN_ZONE', []);
      for (const id of zone.roomIds) if (!servedRooms.includes(id)) servedRooms.push(id);
      return { circuit: c, indoor, ...a2lSpace(zone, indoor, load), zoneName: zone.name };
    });
    // The outdoor unit meets the coincident load of every room it serves (one peak hour for all of them).
    const c = coincidentLoad({ loads, roomIds: servedRooms });
    const sum = { sensibleBtuh: c.sensibleBtuh, latentBtuh: c.latentBtuh, heatingBtuh: c.heatingBtuh };
    const sizing = checkSizing({
      unit: outdoor,
      equipmentType: outdoor.equipmentType,
      load: sum,
      coolingDesignF: dc.outdoorCoolingDryBulbF,
      heatingDesignF: dc.outdoorHeatingDryBulbF,
      policy,
    });
    const p = `${s.key}:`;
    const kit =
      s.heatKitKey === undefined
        ? undefined
        : lookup(heatKits, s.heatKitKey, 'UNKNOWN_EQUIPMENT', ['systems', si, 'heatKitKey']);
    const combination = withHeatKitFit(
      checkCombination({ outdoor, indoor: circuits.map((c) => c.indoor) }),
      kit,
      circuits.map((c) => c.indoor),
      outdoor.key,
      s.name,
    );
    const refrigerant = refrigerantPlan({ outdoor, circuits, keyPrefix: p });
    const electrical = electricalPlan({ mcaA: outdoor.mcaA, mocpA: outdoor.mocpA, input: s.electrical, keyPrefix: p });
    // The heat kit's circuit runs from the panel to the air handler: its run and its disconnect are the air
    // handler's, not the outdoor unit's. A run not entered is taken as the outdoor unit's, and the plan says so.
    const kitRunFt = s.electrical.heatKitCircuitLengthFt;
    const kitElectrical = kit
      ? electricalPlan({
          mcaA: kit.mcaA,
          mocpA: kit.mocpA,
          input: {
            ...s.electrical,
            circuitLengthFt: kitRunFt ?? s.electrical.circuitLengthFt,
            disconnectDistanceFt: s.electrical.heatKitDisconnectDistanceFt ?? 0,
            disconnectVisible: true,
          },
          keyPrefix: `${p}heat-kit:`,
          label: 'heat kit',
          ...(kitRunFt === undefined ? { assumedRun: heatKitRunAssumed(s.electrical.circuitLengthFt) } : {}),
        })
      : null;
    const heating =
      outdoor.heating && outdoor.heating.length > 0 && outdoor.equipmentType.startsWith('heat-pump')
        ? heatingBalance({
            keyPrefix: p,
            who: s.name,
            heating: outdoor.heating,
            heatLossBtuh: sum.heatingBtuh,
            heatingDesignF: dc.outdoorHeatingDryBulbF,
            indoorF: dc.indoorHeatingF,
            heatKit: kit,
          })
        : null;
    const rule = technologyTransitionsCheck({
      refrigerant: outdoor.refrigerant,
      installDate: design.installDate,
      componentsMadeBefore2025: design.componentsMadeBefore2025,
    });
    for (const m of refrigerant.blockers)
      blockers.push({
        code: 'limit-exceeded',
        kind: refrigerant.a2lBlockers.includes(m) ? 'a2l' : 'lines',
        systemKey: s.key,
        message: m,
      });
    for (const m of combination.refusals)
      blockers.push({ code: 'combination-refused', kind: 'combination', systemKey: s.key, message: m });
    if (rule.blocker)
      blockers.push({ code: 'limit-exceeded', kind: 'refrigerant-rule', systemKey: s.key, message: rule.message });
    for (const e of [electrical, ...(kitElectrical ? [kitElectrical] : [])])
      for (const x of e.explanations)
        if (x.status === 'blocker')
          blockers.push({
            code: 'limit-exceeded',
            kind: 'electrical',
            systemKey: s.key,
            message: `${s.name}: ${x.verdict ?? x.text}`,
          });
    if (kitElectrical) warnings.push(...kitElectrical.warnings);
    forTakeoff.push({
      system: s,
      outdoor,
      indoorByZone,
      refrigerant,
      electrical,
      heatKit: kit,
      heatKitElectrical: kitElectrical,
    });
    const explanations: Explanation[] = [
      ...explainSizing({
        keyPrefix: `${p}`,
        who: s.name,
        sizing,
        cooling: outdoor.cooling,
        heating: outdoor.heating,
        equipmentType: outdoor.equipmentType,
        coolingDesignF: dc.outdoorCoolingDryBulbF,
        heatingDesignF: dc.outdoorHeatingDryBulbF,
        sensibleHeatRatio: outdoor.sensibleHeatRatio,
        sensibleLoadBtuh: sum.sensibleBtuh,
        latentLoadBtuh: sum.latentBtuh,
        backupHeat: kit,
      }),
      ...(heating ? heating.explanations : []),
      { ...combination.explanation, key: `${p}combination` },
      ...refrigerant.circuits.map((c) => c.explanation),
      ...ductsOfSystem(s.key).map(({ d, share }) =>
        explainDuctLoads(s.key, s.name, d, s.ducts ?? walkThroughDucts(home), share),
      ),
      ...refrigerant.explanations,
      ...electrical.explanations,
      ...(kitElectrical ? kitElectrical.explanations : []),
      explanation({
        key: `${p}refrigerant-rule`,
        label: `Refrigerant rule, ${s.name}`,
        value: rule.gwp,
        unit: 'GWP',
        valueText: `${outdoor.refrigerant}, GWP ${rule.gwp}`,
        text: rule.message,
        status: rule.blocker ? 'blocker' : rule.verdict === 'check-date' ? 'warning' : 'ok',
        source: 'US EPA Technology Transitions rule, 40 CFR Part 84 Subpart B',
      }),
    ];
    if (rule.verdict === 'check-date' || rule.verdict === 'allowed-old-components') warnings.push(rule.message);
    return {
      systemKey: s.key,
      name: s.name,
      outdoorUnitKey: outdoor.key,
      sizing,
      combination,
      refrigerant,
      electrical,
      heating,
      heatKitKey: kit ? kit.key : null,
      heatKitElectrical: kitElectrical,
      refrigerantRule: rule,
      explanations,
    };
  });
  const priced = priceLines({
    lines: buildTakeoff({
      systems: forTakeoff,
      labor: laborTableOf(priceBook),
      refrigerantSoldBy: (r) => priceBook.items[`refrigerant:${r}`]?.soldBy ?? 'lb',
    }),
    priceBook,
  });
  const anyA2l = systems.some((s) => s.refrigerant.safetyClass === 'A2L');
  const price = priceOption({ lines: priced.lines, pricing, priceBook });
  const explanations: Explanation[] = !explainPrice
    ? []
    : priced.lines.map((l) =>
        explanation({
          key: `line:${l.itemKey}`,
          label: l.description,
          value: l.extendedCostCents,
          unit: 'cents',
          valueText: explainExtension({
            quantity: l.quantity,
            unit: l.unit,
            unitCents: l.unitCostCents,
            extendedCents: l.extendedCostCents,
          }),
          text: `${l.quantity} ${l.unit}: ${l.derivation}; ${explainExtension({ quantity: l.quantity, unit: l.unit, unitCents: l.unitCostCents, extendedCents: l.extendedCostCents })}`,
          status: l.unitCostCents === null ? 'warning' : 'ok',
        }),
      );
  if (explainPrice) {
    for (const line of price.lineSells)
      explanations.push(explainLineSell({ line }), explainLineTax({ line, taxOn: pricing.taxOn }));
    explanations.push(
      ...explainOptionPrice({
        price,
        pricing,
        plans: pricing.financing
          ? [{ key: 'financing', name: `${pricing.financing.months} months`, ...pricing.financing }]
          : [],
      }),
    );
  }
  return {
    loads,
    zones,
    systems,
    takeoff: priced.lines,
    price,
    warnings: [
      ...warnings,
      ...zones.flatMap((z) => z.sizing.warnings),
      ...systems.flatMap((s) => [
        ...s.sizing.warnings,
        ...s.combination.warnings,
        ...s.refrigerant.warnings,
        ...s.electrical.warnings,
      ]),
      ...priced.warnings,
    ],
    blockers,
    explanations,
    cautions: [
      CAUTIONS.estimate,
      CAUTIONS.makerAndCode,
      CAUTIONS.refrigerant,
      ...(anyA2l ? [CAUTIONS.a2l] : []),
      CAUTIONS.pressureTest,
      CAUTIONS.electrical,
      CAUTIONS.homeowner,
    ],
    isEstimate: true,
  };
}
