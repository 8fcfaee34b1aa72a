import type { TakeoffLine } from '../takeoff/lines';
import { roundCentsHalfUp, roundHalfUp } from '../rounding';
import { extendCents, monthlyPaymentCents, percentOfCents, priceFromMarginCents, priceFromMarkupCents } from './money';
import type { PriceBook, Pricing, TaxRule } from './schemas';
import { sellPriceCents, type SellRule } from '../catalog/sell-rule';

/** A takeoff line with its cost. `unitCostCents` null when the price book lacks the item (extended 0, with a warning). */
export interface PricedLine extends TakeoffLine {
  readonly unitCostCents: number | null;
  readonly extendedCostCents: number;
}

/** Prices each line from the price book (labor at the labor rate); extended = quantity × unit, half-up to the cent. */
export function priceLines({
  lines,
  priceBook,
}: {
  readonly lines: readonly TakeoffLine[];
  readonly priceBook: PriceBook;
}): { lines: PricedLine[]; warnings: string[] } {
  const warnings: string[] = [];
  const priced = lines.map((line): PricedLine => {
    const unit =
      line.category === 'labor'
        ? (priceBook.items[line.itemKey]?.unitCostCents ?? priceBook.laborRateCents)
        : (priceBook.items[line.itemKey]?.unitCostCents ?? null);
    if (unit === null)
      warnings.push(`No price for "${line.description}" (${line.itemKey}) in the price book; it is counted at $0.`);
    // Explicit fields rather than object spread, which is slow on this hot path.
    return {
      itemKey: line.itemKey,
      description: line.description,
      quantity: line.quantity,
      unit: line.unit,
      category: line.category,
      derivation: line.derivation,
      unitCostCents: unit,
      extendedCostCents: unit === null ? 0 : extendCents({ quantity: line.quantity, unitCents: unit }),
    };
  });
  return { lines: priced, warnings };
}

/** Where a line's sell rule came from: its item's override, its category, the company default, or the option's own rule. */
export type LineRuleSource = 'item' | 'category' | 'company' | 'option';

/** One line at its sell price: the rule that priced it and where that rule came from. */
export interface LineSell {
  readonly itemKey: string;
  readonly description: string;
  readonly category: TakeoffLine['category'];
  readonly costCents: number;
  /** cost → price by `rule`, half-up to the cent. In 'option' mode a view only: the option rounds its two sums once. */
  readonly sellCents: number;
  readonly rule: SellRule;
  readonly source: LineRuleSource;
  /** The category's name (source 'category') or the item's description (source 'item'); null otherwise. */
  readonly from: string | null;
  /** The price-book category the line's item belongs to, by name; null when the book names none. */
  readonly categoryName: string | null;
  /** false when the item's category is not taxable (true when the book says nothing). */
  readonly categoryTaxable: boolean;
  /** In the tax base: the option's tax rule covers lines of this kind and its category is taxable. */
  readonly taxed: boolean;
}

/** Whether the tax rule covers a line of this kind (before its category's own flag). */
export function taxRuleCovers(rule: TaxRule, category: TakeoffLine['category']): boolean {
  switch (rule) {
    case 'none':
      return false;
    case 'total':
      return true;
    case 'materials':
    case 'materials-cost':
      return category !== 'labor';
    case 'materials-only':
      return category === 'material';
  }
}

/**
 * Each line at its sell price. Pricing 'line': the price book's rule for the line's item (its own
 * override, else its category's), else the company default (`pricing.method`/`percent`); 'option':
 * the option's own rule on every line.
 */
export function sellLines({
  lines,
  pricing,
  priceBook,
}: {
  readonly lines: readonly PricedLine[];
  readonly pricing: Pricing;
  readonly priceBook?: PriceBook | undefined;
}): LineSell[] {
  const fallback: SellRule = { method: pricing.method, percent: pricing.percent };
  const byLine = pricing.sellRulesBy === 'line';
  return lines.map((l): LineSell => {
    const book = priceBook?.items[l.itemKey];
    const item = byLine ? book : undefined;
    const own = item?.sellRule;
    const categoryTaxable = book?.taxable !== false;
    const rule = own ?? fallback;
    const source: LineRuleSource = !byLine ? 'option' : own ? (item?.ruleSource ?? 'item') : 'company';
    return {
      itemKey: l.itemKey,
      description: l.description,
      category: l.category,
      costCents: l.extendedCostCents,
      sellCents: sellPriceCents({ costCents: l.extendedCostCents, rule }),
      rule,
      source,
      from: own ? (item?.ruleFrom ?? null) : null,
      categoryName: book?.categoryName ?? null,
      categoryTaxable,
      taxed: categoryTaxable && taxRuleCovers(pricing.taxOn, l.category),
    };
  });
}

/** The price of one option, all cents. */
export interface OptionPrice {
  readonly equipmentCostCents: number;
  readonly materialsCostCents: number;
  readonly laborCostCents: number;
  readonly costCents: number;
  readonly goodsSellCents: number;
  readonly laborSellCents: number;
  readonly sellCents: number;
  readonly discountCents: number;
  readonly subtotalCents: number;
  readonly taxableCents: number;
  readonly taxCents: number;
  /** Tax the contractor pays on its own cost ('materials-cost' rule), cents; part of `costCents`, not of the total. */
  readonly contractorTaxCents: number;
  readonly totalCents: number;
  readonly depositCents: number;
  readonly balanceCents: number;
  readonly monthlyPaymentCents: number | null;
  /** (subtotal − cost) ÷ subtotal, %, 2 decimals half-up; 0 when the subtotal is 0. */
  readonly grossMarginPercent: number;
  /** How the sell price was made: one rule for the option, or each line by its own rule. */
  readonly sellRulesBy: Pricing['sellRulesBy'];
  /** Every line at its sell price with its rule (in 'line' mode their sums are the goods and labor sell). */
  readonly lineSells: readonly LineSell[];
}

const sum = (xs: readonly number[]): number => xs.reduce((a, b) => a + b, 0);

/**
 * Rolls priced lines up into an option price: sell = markup or margin on goods (equipment +
 * materials) and on labor separately ('option'), or the sum of each line at its own price-book
 * rule ('line', `priceBook` gives the rules); discounts (percents of the sell price, then fixed
 * amounts, capped at the sell price); tax on goods (their share of the discounted price) or
 * on the total; deposit; monthly payment on the balance. Every step rounds half-up to the cent.
 */
export function priceOption({
  lines,
  pricing,
  priceBook,
}: {
  readonly lines: readonly PricedLine[];
  readonly pricing: Pricing;
  readonly priceBook?: PriceBook | undefined;
}): OptionPrice {
  const of = (c: TakeoffLine['category']) => sum(lines.filter((l) => l.category === c).map((l) => l.extendedCostCents));
  const equipment = of('equipment');
  const materials = of('material');
  const laborCost = of('labor');
  const sell = (costCents: number) =>
    pricing.method === 'margin'
      ? priceFromMarginCents({ costCents, marginPercent: pricing.percent })
      : priceFromMarkupCents({ costCents, markupPercent: pricing.percent });
  const lineSells = sellLines({ lines, pricing, priceBook });
  const byLine = pricing.sellRulesBy === 'line';
  const sold = (c: TakeoffLine['category']) => sum(lineSells.filter((l) => l.category === c).map((l) => l.sellCents));
  const goodsSell = byLine ? sold('equipment') + sold('material') : sell(equipment + materials);
  const laborSell = byLine ? sold('labor') : sell(laborCost);
  const sellCents = goodsSell + laborSell;
  const percentOff = sum(
    pricing.discounts
      .filter((d) => d.kind === 'percent')
      .map((d) => percentOfCents({ cents: sellCents, percent: d.value })),
  );
  const amountOff = sum(pricing.discounts.filter((d) => d.kind === 'amount').map((d) => roundCentsHalfUp(d.value)));
  const discount = Math.min(sellCents, percentOff + amountOff);
  const subtotal = sellCents - discount;
  const rule = pricing.taxOn;
  // The tax base: the lines the rule covers whose category is taxable (issue 13), at their share of the
  // discounted price (discounts fall on every line alike). Line by line: each taxed line's own sell price;
  // one rule for the option: goods and labor each sell at one rule, so a taxed part's share of their sell
  // is its share of their cost.
  const taxedCost = (c: TakeoffLine['category'] | 'goods') =>
    sum(
      lineSells
        .filter((l) => l.taxed && (c === 'goods' ? l.category !== 'labor' : l.category === c))
        .map((l) => l.costCents),
    );
  const share = (sellPart: number, taxedPartCost: number, partCost: number) =>
    partCost === 0
      ? 0
      : taxedPartCost === partCost
        ? sellPart
        : roundCentsHalfUp((sellPart * taxedPartCost) / partCost);
  const taxedSell = byLine
    ? sum(lineSells.filter((l) => l.taxed).map((l) => l.sellCents))
    : share(goodsSell, taxedCost('goods'), equipment + materials) + share(laborSell, taxedCost('labor'), laborCost);
  const taxable =
    rule === 'none' || rule === 'materials-cost' || sellCents === 0
      ? 0
      : taxedSell === sellCents
        ? subtotal
        : roundCentsHalfUp((taxedSell * subtotal) / sellCents);
  const tax = percentOfCents({ cents: taxable, percent: pricing.taxRatePercent });
  const contractorTax =
    rule === 'materials-cost' ? percentOfCents({ cents: taxedCost('goods'), percent: pricing.taxRatePercent }) : 0;
  const total = subtotal + tax;
  const deposit =
    pricing.deposit.kind === 'percent'
      ? percentOfCents({ cents: total, percent: pricing.deposit.value })
      : Math.min(total, roundCentsHalfUp(pricing.deposit.value));
  const balance = total - deposit;
  const cost = equipment + materials + laborCost + contractorTax;
  return {
    equipmentCostCents: equipment,
    materialsCostCents: materials,
    laborCostCents: laborCost,
    costCents: cost,
    goodsSellCents: goodsSell,
    laborSellCents: laborSell,
    sellCents,
    discountCents: discount,
    subtotalCents: subtotal,
    taxableCents: taxable,
    taxCents: tax,
    contractorTaxCents: contractorTax,
    totalCents: total,
    depositCents: deposit,
    balanceCents: balance,
    monthlyPaymentCents: pricing.financing
      ? monthlyPaymentCents({
          principalCents: balance,
          aprPercent: pricing.financing.aprPercent,
          months: pricing.financing.months,
        })
      : null,
    grossMarginPercent: subtotal > 0 ? roundHalfUp(((subtotal - cost) / subtotal) * 100, 2) : 0,
    sellRulesBy: pricing.sellRulesBy,
    lineSells,
  };
}

/** Options side by side, each with its difference in total from the first option (cents). */
export function compareOptions({
  options,
}: {
  readonly options: readonly { readonly key: string; readonly name: string; readonly price: OptionPrice }[];
}) {
  const base = options[0]?.price.totalCents ?? 0;
  return options.map((o) => ({
    key: o.key,
    name: o.name,
    price: o.price,
    differenceFromFirstCents: o.price.totalCents - base,
  }));
}
