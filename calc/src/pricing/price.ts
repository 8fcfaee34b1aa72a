import type { TakeoffLine } from '../takeoff/lines';
import { roundCentsHalfUp, roundHalfUp } from '../rounding';
import { extendCents, monthlyPaymentCents, percentOfCents, priceFromMarginCents, priceFromMarkupCents } from './money';
import type { PriceBook, Pricing } from './schemas';

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
}

/** Materials' share of the goods sell price, cents (half-up): goods sell × materials cost ÷ (equipment + materials cost). */
function materialsSellShare(goodsSell: number, equipmentCost: number, materialsCost: number): number {
  const goodsCost = equipmentCost + materialsCost;
  return goodsCost === 0 ? 0 : roundCentsHalfUp((goodsSell * materialsCost) / goodsCost);
}

const sum = (xs: readonly number[]): number => xs.reduce((a, b) => a + b, 0);

/**
 * Rolls priced lines up into an option price: sell = markup or margin on goods (equipment +
 * materials) and on labor separately; discounts (percents of the sell price, then fixed
 * amounts, capped at the sell price); tax on goods (their share of the discounted price) or
 * on the total; deposit; monthly payment on the balance. Every step rounds half-up to the cent.
 */
export function priceOption({
  lines,
  pricing,
}: {
  readonly lines: readonly PricedLine[];
  readonly pricing: Pricing;
}): OptionPrice {
  const of = (c: TakeoffLine['category']) => sum(lines.filter((l) => l.category === c).map((l) => l.extendedCostCents));
  const equipment = of('equipment');
  const materials = of('material');
  const laborCost = of('labor');
  const sell = (costCents: number) =>
    pricing.method === 'margin'
      ? priceFromMarginCents({ costCents, marginPercent: pricing.percent })
      : priceFromMarkupCents({ costCents, markupPercent: pricing.percent });
  const goodsSell = sell(equipment + materials);
  const laborSell = sell(laborCost);
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
  // Goods (or materials alone) carry their share of the discounted price: discounts fall on every line alike.
  const taxedSell =
    rule === 'materials'
      ? goodsSell
      : rule === 'materials-only'
        ? materialsSellShare(goodsSell, equipment, materials)
        : 0;
  const taxable =
    rule === 'none' || rule === 'materials-cost'
      ? 0
      : rule === 'total'
        ? subtotal
        : sellCents === 0
          ? 0
          : roundCentsHalfUp((taxedSell * subtotal) / sellCents);
  const tax = percentOfCents({ cents: taxable, percent: pricing.taxRatePercent });
  const contractorTax =
    rule === 'materials-cost' ? percentOfCents({ cents: equipment + materials, percent: pricing.taxRatePercent }) : 0;
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
