import { all, create } from 'mathjs';
import {
  categorySchema,
  catalogModelSchema,
  kitSchema,
  laborTaskSchema,
  materialSchema,
  refrigerantCostSchema,
  type PricedLine,
} from '@calc';
import { demoCompanyData } from '../../fixtures/demo-company-data';

/**
 * The money tests' outside reference: mathjs with 64-digit BigNumbers. mathjs rounds half away from
 * zero, which is half-up for the non-negative amounts priced here.
 */
export const m = create(all ?? {}, { number: 'BigNumber', precision: 64 });

/** `expr` evaluated in BigNumbers over `scope`, rounded to a whole number of cents (half-up). */
export const exactCents = (expr: string, scope: Record<string, number> = {}): number =>
  Number(
    m
      .round(
        m.evaluate(expr, Object.fromEntries(Object.entries(scope).map(([k, v]) => [k, m.bignumber(v)]))) as ReturnType<
          typeof m.bignumber
        >,
      )
      .toString(),
  );

/** A takeoff line of one unit at `cents`, as the design engine hands lines to the pricing. */
export const pricedLine = (itemKey: string, category: PricedLine['category'], cents: number): PricedLine => ({
  itemKey,
  description: itemKey,
  quantity: 1,
  unit: 'each',
  category,
  derivation: 'test',
  unitCostCents: cents,
  extendedCostCents: cents,
});

/** The demo company's price-book rows (invented), each parsed by calc's schema as the server stores them. */
export function demoPriceBookRows() {
  const data = demoCompanyData();
  return {
    data,
    categories: data.categories.map((c) => categorySchema.parse(c)),
    models: data.models.map((x) => catalogModelSchema.parse(x)),
    materials: data.materials.map((x) => materialSchema.parse(x)),
    labor: data.labor.map((x) => laborTaskSchema.parse(x)),
    kits: data.kits.map((x) => kitSchema.parse(x)),
    refrigerants: data.refrigerants.map((x) => refrigerantCostSchema.parse(x)),
  };
}
