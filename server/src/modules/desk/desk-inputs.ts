import type { EntityManager } from '@mikro-orm/postgresql';
import {
  catalogModelSchema,
  categorySchema,
  discountLimitSchema,
  financingPlanSchema,
  kitSchema,
  laborTaskSchema,
  materialSchema,
  refrigerantCostSchema,
  type CatalogModel,
  type Category,
  type DiscountLimit,
  type FinancingPlan,
  type Kit,
  type LaborTask,
  type Material,
  type PriceBookSettings,
  type RefrigerantCost,
} from '@calc';
import { getSettings } from '../company-data/price-book-settings.service';

/**
 * Everything of the company an option is worked out from, read once per request: the catalog models
 * (active and retired: a retired model chosen earlier still computes), the price book and its settings.
 */
export interface CompanyDesk {
  readonly models: ReadonlyMap<string, CatalogModel>;
  readonly laborTasks: readonly LaborTask[];
  readonly materials: readonly Material[];
  readonly kits: readonly Kit[];
  readonly refrigerants: readonly RefrigerantCost[];
  /** The price book's categories: the sell rule of every item that names one (issue 13). */
  readonly categories: readonly Category[];
  readonly financing: readonly FinancingPlan[];
  readonly discountLimits: ReadonlyMap<string, DiscountLimit>;
  readonly settings: PriceBookSettings;
}

/** One row of the company's catalog and price book as stored (`company_data_row`). */
export type CompanyDataRow = { dataset: string; data: unknown };

/** The datasets an option is worked out from, in the order the reads list them (by key). */
export const DESK_DATASETS_SQL = `('models', 'labor', 'materials', 'kits', 'refrigerants', 'categories', 'financing', 'discount-limits')`;

export async function loadCompanyDesk(em: EntityManager, companyId: string): Promise<CompanyDesk> {
  const rows = await em.execute<CompanyDataRow[]>(
    `select dataset, data from "company_data_row" where company_id = ? and dataset in ${DESK_DATASETS_SQL}
     order by key`,
    [companyId],
  );
  return companyDeskFromRows(rows, (await getSettings(em, companyId)).data);
}

/** The company's rows (ordered by key) and price-book settings as the engine's inputs. */
export function companyDeskFromRows(rows: readonly CompanyDataRow[], settings: PriceBookSettings): CompanyDesk {
  const models = new Map<string, CatalogModel>();
  const laborTasks: LaborTask[] = [];
  const materials: Material[] = [];
  const kits: Kit[] = [];
  const refrigerants: RefrigerantCost[] = [];
  const categories: Category[] = [];
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
    } else if (r.dataset === 'materials') {
      const m = materialSchema.safeParse(r.data);
      if (m.success) materials.push(m.data);
    } else if (r.dataset === 'kits') {
      const k = kitSchema.safeParse(r.data);
      if (k.success) kits.push(k.data);
    } else if (r.dataset === 'refrigerants') {
      const c = refrigerantCostSchema.safeParse(r.data);
      if (c.success) refrigerants.push(c.data);
    } else if (r.dataset === 'categories') {
      const c = categorySchema.safeParse(r.data);
      if (c.success) categories.push(c.data);
    } else if (r.dataset === 'financing') {
      const f = financingPlanSchema.safeParse(r.data);
      if (f.success && f.data.active) financing.push(f.data);
    } else {
      const d = discountLimitSchema.safeParse(r.data);
      if (d.success) discountLimits.set(d.data.key, d.data);
    }
  }
  return { models, laborTasks, materials, kits, refrigerants, categories, financing, discountLimits, settings };
}
