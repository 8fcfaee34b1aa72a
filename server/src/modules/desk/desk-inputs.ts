import type { EntityManager } from '@mikro-orm/postgresql';
import {
  catalogModelSchema,
  discountLimitSchema,
  financingPlanSchema,
  indoorUnitSchema,
  laborTaskSchema,
  outdoorUnitSchema,
  type CatalogModel,
  type DiscountLimit,
  type EquipmentCatalog,
  type FinancingPlan,
  type IndoorUnit,
  type LaborTask,
  type OutdoorUnit,
  type PriceBook,
  type PriceBookSettings,
} from '@calc';
import { getSettings } from '../company-data/price-book-settings.service';

/**
 * Everything of the company an option is worked out from, read once per request: the catalog models
 * (active and retired: a retired model chosen earlier still computes), the price book and its settings.
 */
export interface CompanyDesk {
  readonly models: ReadonlyMap<string, CatalogModel>;
  readonly laborTasks: readonly LaborTask[];
  readonly financing: readonly FinancingPlan[];
  readonly discountLimits: ReadonlyMap<string, DiscountLimit>;
  readonly settings: PriceBookSettings;
}

type Row = { dataset: string; data: unknown };

export async function loadCompanyDesk(em: EntityManager, companyId: string): Promise<CompanyDesk> {
  const rows = await em.execute<Row[]>(
    `select dataset, data from "company_data_row" where company_id = ? and dataset in ('models', 'labor', 'financing', 'discount-limits') order by key`,
    [companyId],
  );
  const models = new Map<string, CatalogModel>();
  const laborTasks: LaborTask[] = [];
  const financing: FinancingPlan[] = [];
  const discountLimits = new Map<string, DiscountLimit>();
  // Rows were checked by calc when written; parsing again applies defaults and keeps the types honest.
  for (const r of rows) {
    if (r.dataset === 'models') {
      const m = catalogModelSchema.safeParse(r.data);
      if (m.success) models.set(m.data.key, m.data);
    } else if (r.dataset === 'labor') {
      const t = laborTaskSchema.safeParse(r.data);
      if (t.success) laborTasks.push(t.data);
    } else if (r.dataset === 'financing') {
      const f = financingPlanSchema.safeParse(r.data);
      if (f.success && f.data.active) financing.push(f.data);
    } else {
      const d = discountLimitSchema.safeParse(r.data);
      if (d.success) discountLimits.set(d.data.key, d.data);
    }
  }
  const settings = (await getSettings(em, companyId)).data;
  return { models, laborTasks, financing, discountLimits, settings };
}

// ---- The catalog records as the design engine's units ------------------------------------------------
// A plain field mapping from issue 12's catalog model to calc's EquipmentCatalog, kept here until calc
// carries its own (desk-calc's catalog adapter replaces this file's mapping part).

const INDOOR_TYPE: Record<NonNullable<CatalogModel['indoorType']>, IndoorUnit['unitType']> = {
  wall: 'wall-head',
  'ceiling-cassette': 'ceiling-cassette',
  'floor-console': 'floor-console',
  'slim-ducted': 'ducted-air-handler',
  'air-handler': 'ducted-air-handler',
};

function equipmentType(m: CatalogModel): OutdoorUnit['equipmentType'] {
  if (m.heatPump) return m.variableSpeed ? 'heat-pump-variable-speed' : 'heat-pump-single-speed';
  return m.variableSpeed ? 'ac-variable-speed' : 'ac-single-speed';
}

const curve = (points: CatalogModel['coolingPoints']) => points.map((p) => ({ outdoorF: p.outdoorF, btuh: p.btuh }));

function outdoorOf(m: CatalogModel): OutdoorUnit | null {
  const r = outdoorUnitSchema.safeParse({
    key: m.key,
    description: m.name,
    equipmentType: equipmentType(m),
    refrigerant: m.refrigerant,
    nominalBtuh: m.nominalCoolingBtuh,
    cooling: curve(m.coolingPoints),
    heating: m.heatingPoints.length ? curve(m.heatingPoints) : undefined,
    maxHeads: m.ports ?? 1,
    connectedRatioPercent:
      m.connectedMinPercent !== undefined && m.connectedMaxPercent !== undefined
        ? { min: m.connectedMinPercent, max: m.connectedMaxPercent }
        : undefined,
    factoryChargeOz: m.factoryChargeOz,
    prechargedLengthFt: m.prechargedLengthFt,
    chargeAdders: m.chargeAdders.map((a) => ({ liquidOdIn: a.liquidOdIn, ozPerFt: a.ozPerFt })),
    maxIndoorHeightDiffFt: m.maxIndoorHeightDiffFt,
    liquidOdIn: m.liquidOdIn,
    portSizesBtuh: m.portSizesBtuh.length ? m.portSizesBtuh : undefined,
    prechargeBasis: m.prechargeBasis,
    minLineLengthFt: m.minLineFt,
    maxLineLengthFt: m.maxLineFt,
    maxTotalLineLengthFt: m.maxTotalLineFt,
    maxLiftFt: m.maxLiftFt,
    mcaA: m.mcaA,
    mocpA: m.mocpA,
  });
  return r.success ? r.data : null;
}

function indoorOf(m: CatalogModel, models: ReadonlyMap<string, CatalogModel>): IndoorUnit | null {
  if (!m.indoorType) return null;
  // A single-zone pair's capacity is rated on the outdoor unit; a head without its own points takes its pair's.
  const pair = m.matchedKeys.map((k) => models.get(k)).find((o) => o?.kind === 'outdoor-single-zone');
  const nominal = m.nominalCoolingBtuh ?? 0;
  const cooling = m.coolingPoints.length
    ? curve(m.coolingPoints)
    : pair?.coolingPoints.length
      ? curve(pair.coolingPoints)
      : [{ outdoorF: 95, btuh: nominal }];
  const heating = m.heatingPoints.length
    ? curve(m.heatingPoints)
    : pair?.heatingPoints.length
      ? curve(pair.heatingPoints)
      : undefined;
  const r = indoorUnitSchema.safeParse({
    key: m.key,
    description: m.name,
    unitType: INDOOR_TYPE[m.indoorType],
    nominalBtuh: nominal,
    cooling,
    heating,
    sensibleHeatRatio: m.sensibleHeatRatio ?? pair?.sensibleHeatRatio,
    liquidOdIn: m.liquidOdIn,
    suctionOdIn: m.suctionOdIn,
  });
  return r.success ? r.data : null;
}

/** The engine's catalog from catalog records (every model given, whatever its state). */
export function engineCatalog(models: ReadonlyMap<string, CatalogModel>): EquipmentCatalog {
  const indoorUnits: IndoorUnit[] = [];
  const outdoorUnits: OutdoorUnit[] = [];
  for (const m of models.values()) {
    if (m.kind === 'indoor') {
      const u = indoorOf(m, models);
      if (u) indoorUnits.push(u);
    } else if (m.kind !== 'heat-kit') {
      const u = outdoorOf(m);
      if (u) outdoorUnits.push(u);
    }
  }
  return { indoorUnits, outdoorUnits };
}

/** The engine's price book: each model's cost under its takeoff key, labor at the company's usual hourly rate. */
export function enginePriceBook(desk: CompanyDesk, models: ReadonlyMap<string, CatalogModel>): PriceBook {
  const items: PriceBook['items'] = {};
  for (const m of models.values()) items[`equipment:${m.key}`] = { unitCostCents: m.costCents };
  const rates = desk.laborTasks.filter((t) => t.active).map((t) => t.rateCentsPerHour);
  rates.sort((a, b) => a - b);
  return { items, laborRateCents: rates[Math.floor(rates.length / 2)] ?? 0 };
}
