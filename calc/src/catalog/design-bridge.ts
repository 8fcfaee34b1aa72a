import type { PriceBook } from '../pricing/schemas';
import { tubeLabel } from '../refrigerant/tube';
import type {
  EquipmentCatalog,
  EquipmentType,
  HeatKit,
  IndoorUnit,
  OutdoorUnit,
  CapacityPoint,
} from '../schemas/equipment';
import type { CatalogModel } from './model';
import type { Category, Kit, LaborTask, Material, RefrigerantCost } from './price-book';
import type { SellRule } from './sell-rule';
import type { LaborHoursKey } from '../takeoff/defaults';

/**
 * The bridge from the company's data (issue 12: catalog models and price-book rows, as calc's
 * schemas parsed them) to what computeDesign reads, so the server hands over the active catalog and
 * price book as they are. Pure field mapping; every model given is mapped whatever its `active`
 * flag, so an option naming a retired model still computes (the caller says "discontinued").
 */

const INDOOR_TYPE: Record<NonNullable<CatalogModel['indoorType']>, IndoorUnit['unitType']> = {
  wall: 'wall-head',
  'ceiling-cassette': 'ceiling-cassette',
  'floor-console': 'floor-console',
  'slim-ducted': 'slim-ducted',
  'air-handler': 'ducted-air-handler',
};

/** The sizing class of a model: heat pump or not, variable speed or single speed (the catalog has no two-stage flag). */
export function equipmentTypeOf(m: Pick<CatalogModel, 'heatPump' | 'variableSpeed'>): EquipmentType {
  if (m.heatPump) return m.variableSpeed ? 'heat-pump-variable-speed' : 'heat-pump-single-speed';
  return m.variableSpeed ? 'ac-variable-speed' : 'ac-single-speed';
}

const curve = (points: CatalogModel['coolingPoints']): CapacityPoint[] =>
  points.map((p) => ({ outdoorF: p.outdoorF, btuh: p.btuh }));

/** An outdoor model as the engine's outdoor unit; null when a field the engine needs is missing. */
export function outdoorUnitOf(m: CatalogModel): OutdoorUnit | null {
  if (!m.kind.startsWith('outdoor-')) return null;
  const nominal = m.nominalCoolingBtuh;
  if (
    nominal === undefined ||
    m.refrigerant === undefined ||
    m.factoryChargeOz === undefined ||
    m.prechargedLengthFt === undefined ||
    m.maxLineFt === undefined ||
    m.maxLiftFt === undefined ||
    m.mcaA === undefined ||
    m.mocpA === undefined ||
    m.coolingPoints.length === 0
  )
    return null;
  const multi = m.kind === 'outdoor-multi-zone';
  const u: OutdoorUnit = {
    key: m.key,
    description: m.name,
    equipmentType: equipmentTypeOf(m),
    refrigerant: m.refrigerant,
    nominalBtuh: Math.max(6000, nominal),
    cooling: curve(m.coolingPoints),
    heating: m.heatingPoints.length > 0 ? curve(m.heatingPoints) : undefined,
    maxHeads: multi ? (m.ports ?? 1) : 1,
    connectedRatioPercent: {
      min: m.connectedMinPercent ?? (multi ? 50 : 10),
      max: m.connectedMaxPercent ?? (multi ? 130 : 200),
    },
    factoryChargeOz: m.factoryChargeOz,
    prechargedLengthFt: Math.min(200, m.prechargedLengthFt),
    chargeAdders: m.chargeAdders.map((a) => ({ liquidOdIn: a.liquidOdIn, ozPerFt: a.ozPerFt })),
    prechargeBasis: m.prechargeBasis ?? 'per-circuit',
    minLineLengthFt: Math.min(50, m.minLineFt ?? 10),
    maxLineLengthFt: m.maxLineFt,
    maxLiftFt: m.maxLiftFt,
    mcaA: Math.max(1, m.mcaA),
    mocpA: Math.max(15, m.mocpA),
  };
  const out: { -readonly [K in keyof OutdoorUnit]: OutdoorUnit[K] } = u;
  if (m.liquidOdIn !== undefined) out.liquidOdIn = m.liquidOdIn;
  if (m.maxTotalLineFt !== undefined) out.maxTotalLineLengthFt = Math.min(600, m.maxTotalLineFt);
  if (m.maxIndoorHeightDiffFt !== undefined) out.maxIndoorHeightDiffFt = m.maxIndoorHeightDiffFt;
  if (m.sensibleHeatRatio !== undefined) out.sensibleHeatRatio = m.sensibleHeatRatio;
  if (multi && m.portSizesBtuh.length > 0) out.portSizesBtuh = m.portSizesBtuh.map((p) => [...p]);
  return out;
}

/**
 * An indoor model as the engine's indoor unit. A head with no capacity points of its own takes its
 * single-zone pair's (the pair is rated as one), else its nominal at 95 °F; null without a type,
 * nominal or connection sizes.
 */
export function indoorUnitOf(m: CatalogModel, models: ReadonlyMap<string, CatalogModel>): IndoorUnit | null {
  if (m.kind !== 'indoor' || m.indoorType === undefined || m.nominalCoolingBtuh === undefined) return null;
  if (m.liquidOdIn === undefined || m.suctionOdIn === undefined) return null;
  let pair: CatalogModel | undefined;
  for (const k of m.matchedKeys) {
    const o = models.get(k);
    if (o?.kind === 'outdoor-single-zone') {
      pair = o;
      break;
    }
  }
  const cooling =
    m.coolingPoints.length > 0
      ? curve(m.coolingPoints)
      : pair && pair.coolingPoints.length > 0
        ? curve(pair.coolingPoints)
        : [{ outdoorF: 95, btuh: m.nominalCoolingBtuh }];
  const heating =
    m.heatingPoints.length > 0
      ? curve(m.heatingPoints)
      : pair && pair.heatingPoints.length > 0
        ? curve(pair.heatingPoints)
        : undefined;
  const u: { -readonly [K in keyof IndoorUnit]: IndoorUnit[K] } = {
    key: m.key,
    description: m.name,
    unitType: INDOOR_TYPE[m.indoorType],
    nominalBtuh: m.nominalCoolingBtuh,
    cooling,
    liquidOdIn: m.liquidOdIn,
    suctionOdIn: m.suctionOdIn,
    needsCondensatePump: false,
  };
  if (heating) u.heating = heating;
  if (m.refrigerantDetection) u.refrigerantDetection = true;
  const shr = m.sensibleHeatRatio ?? pair?.sensibleHeatRatio;
  if (shr !== undefined) u.sensibleHeatRatio = shr;
  return u;
}

/** A heat-kit model as the engine's heat kit (its own MCA/MOCP, else 125 % of kW at 240 V and the next breaker up). */
export function heatKitOf(m: CatalogModel): HeatKit | null {
  if (m.kind !== 'heat-kit' || m.heatKitKw === undefined) return null;
  // Resistance heat is a continuous load: 125 % of its current [PUB: NEC 424.3(B)], I = W / V.
  const mca = m.mcaA ?? Math.round(((m.heatKitKw * 1000) / 240) * 1.25 * 10) / 10;
  return {
    key: m.key,
    description: m.name,
    kw: m.heatKitKw,
    ...(m.matchedKeys.length > 0 ? { fitsModelKeys: [...m.matchedKeys] } : {}),
    mcaA: Math.max(1, mca),
    mocpA: Math.max(15, m.mocpA ?? mca),
  };
}

/** The engine's catalog from the company's models (any iterable; a Map's values or an array). */
export function designCatalogFromModels(models: Iterable<CatalogModel>): EquipmentCatalog {
  const byKey = new Map<string, CatalogModel>();
  for (const m of models) byKey.set(m.key, m);
  const indoorUnits: IndoorUnit[] = [];
  const outdoorUnits: OutdoorUnit[] = [];
  const heatKits: HeatKit[] = [];
  for (const m of byKey.values()) {
    if (m.kind === 'indoor') {
      const u = indoorUnitOf(m, byKey);
      if (u) indoorUnits.push(u);
    } else if (m.kind === 'heat-kit') {
      const k = heatKitOf(m);
      if (k) heatKits.push(k);
    } else {
      const u = outdoorUnitOf(m);
      if (u) outdoorUnits.push(u);
    }
  }
  return { indoorUnits, outdoorUnits, heatKits };
}

type PriceBookItem = { -readonly [K in keyof PriceBook['items'][string]]: PriceBook['items'][string][K] };

/**
 * Which labor task prices each labor line of the takeoff (its hourly rate), by task key. The takeoff
 * counts hours; a company whose task keys differ passes its own map.
 */
export const DEFAULT_LABOR_TASK_FOR: Readonly<Record<string, string>> = {
  'labor:mount-indoor:wall-head': 'mount-wall-head',
  'labor:mount-indoor:ceiling-cassette': 'mount-cassette',
  'labor:mount-indoor:floor-console': 'mount-floor-console',
  'labor:mount-indoor:slim-ducted': 'mount-slim-ducted',
  'labor:mount-indoor:ducted-air-handler': 'mount-air-handler',
  'labor:run-line-set': 'line-set-run',
  'labor:wall-penetration': 'wall-penetration',
  'labor:condensate-gravity': 'condensate-gravity',
  'labor:condensate-pump': 'condensate-pump',
  'labor:line-cover': 'line-cover',
  'labor:set-outdoor': 'set-outdoor-pad',
  'labor:electrical': 'electrical-base',
  'labor:pressure-test-evacuate': 'pressure-test-evacuate',
  'labor:charge-startup': 'charge-startup',
};

/**
 * Which labor task gives each entry of the takeoff's labor table its hours (the task's hours per unit),
 * by task key. A line made of two entries (a base and a per-foot part) takes each from its own task.
 */
export const DEFAULT_LABOR_HOURS_TASK: Readonly<Record<LaborHoursKey, string>> = {
  mountWallHead: 'mount-wall-head',
  mountCassette: 'mount-cassette',
  mountFloorConsole: 'mount-floor-console',
  mountSlimDucted: 'mount-slim-ducted',
  mountAirHandler: 'mount-air-handler',
  setOutdoorPad: 'set-outdoor-pad',
  setOutdoorBracket: 'set-outdoor-bracket',
  lineSetBase: 'line-set-base',
  lineSetPerFt: 'line-set-run',
  wallPenetration: 'wall-penetration',
  condensateGravity: 'condensate-gravity',
  condensatePump: 'condensate-pump',
  lineCoverPerFt: 'line-cover',
  electricalBase: 'electrical-base',
  electricalPerFt: 'electrical-run',
  pressureTestEvacuate: 'pressure-test-evacuate',
  chargeStartupBase: 'charge-startup',
  chargeStartupPerCircuit: 'charge-circuit',
};

/**
 * The engine's price book (cost per takeoff item key, cents) from the company's data:
 * - `equipment:<model>` ← the model's cost; heat kits likewise;
 * - `line-set-kit:<liquid>x<suction>:<n>ft` ← the line-set kit of those sizes and length;
 * - `refrigerant:<R>` ← the refrigerant's cost per lb or per oz (`soldBy`: the takeoff counts that unit), in its category;
 * - `labor:*` ← the hourly rate of the task named in `laborTaskFor` (default DEFAULT_LABOR_TASK_FOR);
 * - any other takeoff key ← the material whose SKU `itemMap` names for it, else the material whose
 *   `takeoffItem` names the key (an active one first), else a material whose SKU is the key itself. Unmapped items stay unpriced (computeDesign warns "No price for …").
 * `laborRateCents` (labor lines with no task) is the median hourly rate of the active tasks.
 * `labor`: the hours of each labor-table entry from its task (`laborHoursTask`, default
 * DEFAULT_LABOR_HOURS_TASK), so the takeoff counts the company's hours, not the default table's.
 * Each item names its category and whether it is taxable (a category with `taxable: false` keeps its
 * lines out of the tax base).
 * Each item carries its sell rule: the row's own override (`ruleSource` 'item'), else its category's
 * ('category', `ruleFrom` = the category's name); a row with neither (or a category not in
 * `categories`) sells at the company default, which pricing applies (issue 13).
 */
export function designPriceBookFromCompany({
  models,
  materials = [],
  labor = [],
  kits = [],
  refrigerants = [],
  categories = [],
  itemMap = {},
  laborTaskFor = DEFAULT_LABOR_TASK_FOR,
  laborHoursTask = DEFAULT_LABOR_HOURS_TASK,
}: {
  readonly models: Iterable<CatalogModel>;
  readonly materials?: readonly Material[];
  readonly labor?: readonly LaborTask[];
  readonly kits?: readonly Kit[];
  readonly refrigerants?: readonly RefrigerantCost[];
  readonly categories?: readonly Category[];
  readonly itemMap?: Readonly<Record<string, string>>;
  readonly laborTaskFor?: Readonly<Record<string, string>>;
  readonly laborHoursTask?: Readonly<Partial<Record<LaborHoursKey, string>>>;
}): PriceBook {
  const items: Record<string, PriceBookItem> = {};
  const categoryByKey = new Map<string, Category>();
  for (const c of categories) categoryByKey.set(c.key, c);
  /** A row's cost with the rule that sells it: its own, else its category's, else none (company default). */
  const item = (
    unitCostCents: number,
    description: string | undefined,
    row: { readonly category?: string | undefined; readonly sellRule?: SellRule | undefined },
  ): PriceBookItem => {
    const out: PriceBookItem = { unitCostCents };
    if (description !== undefined) out.description = description;
    const category = row.category === undefined ? undefined : categoryByKey.get(row.category);
    if (category) {
      out.categoryName = category.name;
      out.taxable = category.taxable;
    }
    if (row.sellRule) {
      out.sellRule = row.sellRule;
      out.ruleSource = 'item';
      if (description !== undefined) out.ruleFrom = description;
    } else if (category) {
      out.sellRule = category.sellRule;
      out.ruleSource = 'category';
      out.ruleFrom = category.name;
    }
    return out;
  };
  for (const m of models) items[`equipment:${m.key}`] = item(m.costCents, m.name, m);
  for (const k of kits)
    if (k.kind === 'line-set' && k.liquidOdIn !== undefined && k.suctionOdIn !== undefined && k.lengthFt !== undefined)
      items[`line-set-kit:${tubeLabel({ odIn: k.liquidOdIn })}x${tubeLabel({ odIn: k.suctionOdIn })}:${k.lengthFt}ft`] =
        item(k.costCents, k.description, k);
  // Refrigerant by the unit the book gives (lb or oz), at its category's rule and tax (issue 13).
  for (const r of refrigerants) {
    const perOz = r.costCentsPerOz !== undefined;
    items[`refrigerant:${r.key}`] = {
      ...item(perOz ? (r.costCentsPerOz ?? 0) : (r.costCentsPerLb ?? 0), `${r.key} refrigerant`, r),
      soldBy: perOz ? 'oz' : 'lb',
    };
  }
  const tasks = new Map<string, LaborTask>();
  for (const t of labor) tasks.set(t.key, t);
  for (const [line, task] of Object.entries(laborTaskFor)) {
    const t = tasks.get(task);
    if (t) items[line] = item(t.rateCentsPerHour, t.description, t);
  }
  const bySku = new Map<string, Material>();
  for (const m of materials) bySku.set(m.key, m);
  for (const m of materials) if (items[m.key] === undefined) items[m.key] = item(m.costCents, m.description, m);
  // A material naming its takeoff item prices it (the first such material wins; inactive ones last).
  const named = [...materials.filter((m) => m.active), ...materials.filter((m) => !m.active)];
  const claimed = new Set<string>();
  for (const m of named)
    if (m.takeoffItem !== undefined && !claimed.has(m.takeoffItem)) {
      claimed.add(m.takeoffItem);
      items[m.takeoffItem] = item(m.costCents, m.description, m);
    }
  for (const [line, sku] of Object.entries(itemMap)) {
    const m = bySku.get(sku);
    if (m) items[line] = item(m.costCents, m.description, m);
  }
  const rates = labor.filter((t) => t.active).map((t) => t.rateCentsPerHour);
  rates.sort((a, b) => a - b);
  const hours: Partial<Record<LaborHoursKey, number>> = {};
  const from: Partial<Record<LaborHoursKey, string>> = {};
  for (const [entry, task] of Object.entries(laborHoursTask) as [LaborHoursKey, string | undefined][]) {
    const t = task === undefined ? undefined : tasks.get(task);
    if (t) {
      hours[entry] = t.hoursPerUnit;
      from[entry] = t.description;
    }
  }
  return {
    items,
    laborRateCents: rates[Math.floor(rates.length / 2)] ?? 0,
    ...(Object.keys(hours).length > 0 ? { labor: { hours, from } } : {}),
  };
}
