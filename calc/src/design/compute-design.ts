import { CalcError } from '../errors';
import { electricalPlan, type ElectricalPlan } from '../electrical/plan';
import { m2FromFt2 } from '../units';
import { coincidentLoad, homeLoadFromParsed, type HomeLoad } from '../loads/home-load';
import { parseOrThrow } from '../parse';
import { priceLines, priceOption, type OptionPrice, type PricedLine } from '../pricing/price';
import {
  priceBookSchema,
  pricingSchema,
  type PriceBook,
  type PriceBookInput,
  type Pricing,
  type PricingInput,
} from '../pricing/schemas';
import { CAUTIONS } from '../refrigerant/cautions';
import { refrigerantPlan, type RefrigerantPlan } from '../refrigerant/circuits';
import { designSchema, type Design, type DesignInput } from '../schemas/design';
import {
  equipmentCatalogSchema,
  type EquipmentCatalog,
  type EquipmentCatalogInput,
  type IndoorUnit,
  type OutdoorUnit,
} from '../schemas/equipment';
import { homeInputSchema, type Home, type HomeInput } from '../schemas/home';
import { checkCombination, checkSizing, type CombinationCheck, type SizingCheck } from '../sizing/match';
import { DEFAULT_SIZING_POLICY, sizingPolicySchema, type SizingPolicy } from '../sizing/policy';
import { buildTakeoff, type SystemForTakeoff } from '../takeoff/build';
import { zoneLoads } from './zone-loads';

export interface ZoneResult {
  readonly zoneKey: string;
  readonly name: string;
  readonly roomIds: readonly string[];
  readonly indoorUnitKey: string;
  readonly sizing: SizingCheck;
}

export interface SystemResult {
  readonly systemKey: string;
  readonly name: string;
  readonly outdoorUnitKey: string;
  readonly sizing: SizingCheck;
  readonly combination: CombinationCheck;
  readonly refrigerant: RefrigerantPlan;
  readonly electrical: ElectricalPlan;
}

export interface DesignResult {
  readonly loads: HomeLoad;
  readonly zones: readonly ZoneResult[];
  readonly systems: readonly SystemResult[];
  readonly takeoff: readonly PricedLine[];
  readonly price: OptionPrice;
  readonly warnings: readonly string[];
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
}: ParsedDesignRequest): DesignResult {
  const loads = homeLoadFromParsed(home);
  const dc = home.designConditions;
  const indoorUnits = byKey(catalog.indoorUnits, (u) => u.key);
  const outdoorUnits = byKey(catalog.outdoorUnits, (u) => u.key);
  const zoneByKey = byKey(design.zones, (z) => z.key);
  const perZone = zoneLoads({ loads, zones: design.zones, roomsById: byKey(home.rooms, (r) => r.id) });
  const warnings: string[] = [];
  const systemOfZone = new Map<string, OutdoorUnit>();
  const outdoorOfSystem = design.systems.map((s, si) => {
    const outdoor = lookup(outdoorUnits, s.outdoorUnitKey, 'UNKNOWN_EQUIPMENT', ['systems', si, 'outdoorUnitKey']);
    s.circuits.forEach((c, ci) => {
      lookup(zoneByKey, c.zoneKey, 'UNKNOWN_ZONE', ['systems', si, 'circuits', ci, 'zoneKey']);
      systemOfZone.set(c.zoneKey, outdoor);
    });
    return outdoor;
  });
  const zones: ZoneResult[] = design.zones.map((z, zi) => {
    const indoor = lookup(indoorUnits, z.indoorUnitKey, 'UNKNOWN_EQUIPMENT', ['zones', zi, 'indoorUnitKey']);
    const load = lookup(perZone, z.key, 'UNKNOWN_ROOM', ['zones', zi, 'roomIds']);
    const outdoor = systemOfZone.get(z.key);
    if (!outdoor) warnings.push(`Zone ${z.name} is not connected to any outdoor unit.`);
    const sizing = checkSizing({
      unit: indoor,
      equipmentType: outdoor?.equipmentType ?? 'heat-pump-variable-speed',
      load,
      coolingDesignF: dc.outdoorCoolingDryBulbF,
      heatingDesignF: dc.outdoorHeatingDryBulbF,
      policy,
    });
    return { zoneKey: z.key, name: z.name, roomIds: z.roomIds, indoorUnitKey: indoor.key, sizing };
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
      return { circuit: c, indoor, roomAreaM2: m2FromFt2({ ft2: load.headRoomAreaFt2 }) };
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
    const combination = checkCombination({ outdoor, indoor: circuits.map((c) => c.indoor) });
    const refrigerant = refrigerantPlan({ outdoor, circuits });
    const electrical = electricalPlan({ mcaA: outdoor.mcaA, mocpA: outdoor.mocpA, input: s.electrical });
    forTakeoff.push({ system: s, outdoor, indoorByZone, refrigerant, electrical });
    return {
      systemKey: s.key,
      name: s.name,
      outdoorUnitKey: outdoor.key,
      sizing,
      combination,
      refrigerant,
      electrical,
    };
  });
  const priced = priceLines({ lines: buildTakeoff({ systems: forTakeoff }), priceBook });
  const anyA2l = systems.some((s) => s.refrigerant.safetyClass === 'A2L');
  return {
    loads,
    zones,
    systems,
    takeoff: priced.lines,
    price: priceOption({ lines: priced.lines, pricing }),
    warnings: [
      ...warnings,
      ...zones.flatMap((z) => z.sizing.warnings),
      ...systems.flatMap((s) => [
        ...s.sizing.warnings,
        ...s.combination.warnings,
        ...s.refrigerant.blockers,
        ...s.refrigerant.warnings,
        ...s.electrical.warnings,
      ]),
      ...priced.warnings,
    ],
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
