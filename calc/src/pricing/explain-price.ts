import { num } from '../errors';
import { explanation, input, type Explanation } from '../explain/explanation';
import { formatMoney, formatNumber, formatPercent } from '../explain/format';
import { roundHalfUp } from '../rounding';
import { marginFromMarkup, markupFromMargin } from '../catalog/sell-rule';
import { monthlyPaymentCents } from './money';
import { taxRuleCovers, type LineSell, type OptionPrice } from './price';
import { TAX_RULE_LABELS, type Pricing } from './schemas';

/**
 * The monthly payment of a financing plan with its formula:
 * "$9,000.00 × 0.6658 % ÷ (1 − (1 + 0.6658 %)^−60) = $182.44 a month for 60 months at 7.99 % APR".
 * [PUB: standard annuity formula, as monthlyPaymentCents]
 */
export function explainMonthlyPayment({
  key,
  planName,
  principalCents,
  aprPercent,
  months,
}: {
  readonly key: string;
  readonly planName: string;
  readonly principalCents: number;
  readonly aprPercent: number;
  readonly months: number;
}): Explanation {
  const payment = monthlyPaymentCents({ principalCents, aprPercent, months });
  const p = formatMoney(principalCents);
  const r = formatPercent(num(aprPercent) / 12, 4);
  const text =
    aprPercent === 0
      ? `${p} ÷ ${months} months = ${formatMoney(payment)} a month at 0 % APR`
      : `${p} × ${r} ÷ (1 − (1 + ${r})^−${months}) = ${formatMoney(payment)} a month for ${months} months at ${formatPercent(aprPercent, 2)} APR`;
  return explanation({
    key,
    label: `Monthly payment, ${planName}`,
    value: payment,
    unit: 'cents',
    valueText: `${formatMoney(payment)} a month`,
    text,
    inputs: [
      input('Amount financed', principalCents, 'cents', p),
      input('APR', aprPercent, '%', formatPercent(aprPercent, 2)),
      input('Term', months, 'months', `${months} months`),
    ],
    verdict: 'An estimate: the lender sets the actual terms.',
    status: 'note',
    source: 'Standard annuity formula, monthly rate = APR ÷ 12',
  });
}

/** Margin and markup are two views of one price: "markup 66.67 % on cost = margin 40 % of price". */
export function explainSellRule({
  method,
  percent,
}: {
  readonly method: 'markup' | 'margin';
  readonly percent: number;
}): string {
  if (method === 'margin') {
    const m = roundHalfUp(markupFromMargin(percent), 2);
    return `margin ${formatPercent(percent, 2)} of the price = markup ${formatPercent(m, 2)} on cost (price = cost ÷ (1 − ${formatPercent(percent, 2)}))`;
  }
  const g = roundHalfUp(marginFromMarkup(percent), 2);
  return `markup ${formatPercent(percent, 2)} on cost = margin ${formatPercent(g, 2)} of the price (price = cost × (1 + ${formatPercent(percent, 2)}))`;
}

/** Where a line's rule came from, in words. */
function ruleOrigin(l: LineSell): string {
  switch (l.source) {
    case 'item':
      return "this item's own rule in the price book";
    case 'category':
      return `the rule of the price-book category "${l.from ?? ''}"`;
    case 'company':
      return "the company's default rule (the price book gives this item no rule of its own or of a category)";
    case 'option':
      return "this option's own rule, on every line";
  }
}

/**
 * One line's sell price and the rule behind it: "$120.00 cost → $200.00: margin 40 % of the price =
 * markup 66.67 % on cost (price = cost ÷ (1 − 40 %)), the rule of the price-book category "Line sets"".
 * Keyed `sell:<item key>` (with the prefix). [PUB: the definitions of markup and gross margin]
 */
export function explainLineSell({
  prefix = '',
  line,
}: {
  readonly prefix?: string;
  readonly line: LineSell;
}): Explanation {
  const rule = explainSellRule(line.rule);
  const option = line.source === 'option';
  return explanation({
    key: `${prefix}sell:${line.itemKey}`,
    label: `Sell price, ${line.description}`,
    value: line.sellCents,
    unit: 'cents',
    valueText: formatMoney(line.sellCents),
    text: `${formatMoney(line.costCents)} cost → ${formatMoney(line.sellCents)}: ${rule}; ${ruleOrigin(line)}${option ? ' (the option rounds its goods and its labor once each, so these lines may differ from its price by a cent)' : ''}`,
    inputs: [
      input('Cost', line.costCents, 'cents', formatMoney(line.costCents)),
      input(
        line.rule.method === 'margin' ? 'Margin' : 'Markup',
        line.rule.percent,
        '%',
        formatPercent(line.rule.percent, 2),
      ),
    ],
    status: 'ok',
    source: 'Markup = (price − cost) ÷ cost; margin = (price − cost) ÷ price',
  });
}

/**
 * Whether one line is in the tax base, and why: the option's tax rule and the line's price-book category
 * ("Not taxed: its price-book category "Labor" is not taxable"). Keyed `tax:<item key>` (with the prefix).
 */
export function explainLineTax({
  prefix = '',
  line,
  taxOn,
}: {
  readonly prefix?: string;
  readonly line: LineSell;
  readonly taxOn: Pricing['taxOn'];
}): Explanation {
  const ruleText = TAX_RULE_LABELS[taxOn];
  const covered = taxRuleCovers(taxOn, line.category);
  const category = line.categoryName === null ? null : `"${line.categoryName}"`;
  let text: string;
  if (!covered)
    text =
      taxOn === 'none'
        ? 'Not taxed: this option charges no tax'
        : `Not taxed: the rule is "${ruleText}", which leaves ${line.category} lines out`;
  else if (!line.categoryTaxable)
    text = `Not taxed: its price-book category ${category ?? ''} is not taxable (the rule "${ruleText}" would cover it)`;
  else
    text = `${taxOn === 'materials-cost' ? 'Tax paid on its cost' : 'Taxed'}: the rule is "${ruleText}"${category === null ? ' and the price book gives this item no category (taxable unless a category says otherwise)' : ` and its category ${category} is taxable`}`;
  return explanation({
    key: `${prefix}tax:${line.itemKey}`,
    label: `Tax, ${line.description}`,
    value: line.taxed ? 1 : 0,
    unit: 'flag',
    valueText: line.taxed ? (taxOn === 'materials-cost' ? 'Tax on our cost' : 'Taxed') : 'Not taxed',
    text,
    inputs: [],
    status: 'ok',
    source: "The company's tax rule and the price book's taxable flag per category",
  });
}

const money = (key: string, label: string, cents: number, text: string, extra: Partial<Explanation> = {}) =>
  explanation({
    key,
    label,
    value: cents,
    unit: 'cents',
    valueText: formatMoney(cents),
    text,
    inputs: extra.inputs ?? [],
    verdict: extra.verdict,
    status: extra.status ?? 'ok',
    source: extra.source,
  });

/**
 * Every number of an option's price with its why: costs, sell (markup or margin), discounts,
 * subtotal, tax by the company's rule, total, deposit, balance, gross margin $ and %, and the
 * monthly payment for each financing plan given. `prefix` keys them per option ("opt-1:").
 */
export function explainOptionPrice({
  prefix = '',
  price,
  pricing,
  plans = [],
}: {
  readonly prefix?: string;
  readonly price: OptionPrice;
  readonly pricing: Pricing;
  readonly plans?: readonly {
    readonly key: string;
    readonly name: string;
    readonly aprPercent: number;
    readonly months: number;
  }[];
}): Explanation[] {
  const m = formatMoney;
  const rule =
    price.sellRulesBy === 'line'
      ? `each line at its price-book rule (${lineRuleCounts(price.lineSells)}; each line's why names its rule)`
      : explainSellRule(pricing);
  const out: Explanation[] = [
    money(
      `${prefix}price:equipment`,
      'Equipment cost',
      price.equipmentCostCents,
      `Sum of the equipment lines at cost = ${m(price.equipmentCostCents)}`,
    ),
    money(
      `${prefix}price:materials`,
      'Materials cost',
      price.materialsCostCents,
      `Sum of the material lines at cost = ${m(price.materialsCostCents)}`,
    ),
    money(
      `${prefix}price:labor`,
      'Labor cost',
      price.laborCostCents,
      `Sum of the labor lines (hours × rate) = ${m(price.laborCostCents)}`,
    ),
    money(
      `${prefix}price:sell`,
      'Price before discounts',
      price.sellCents,
      `Equipment and materials ${m(price.equipmentCostCents + price.materialsCostCents)} → ${m(price.goodsSellCents)}; labor ${m(price.laborCostCents)} → ${m(price.laborSellCents)}; ${rule}; ${m(price.goodsSellCents)} + ${m(price.laborSellCents)} = ${m(price.sellCents)}`,
      { source: 'Markup = (price − cost) ÷ cost; margin = (price − cost) ÷ price' },
    ),
  ];
  const discountParts = pricing.discounts.map((d) =>
    d.kind === 'percent' ? `${d.label} ${formatPercent(d.value, 2)}` : `${d.label} ${m(roundHalfUp(d.value))}`,
  );
  out.push(
    money(
      `${prefix}price:discount`,
      'Discounts',
      price.discountCents,
      discountParts.length === 0
        ? 'No discount'
        : `${discountParts.join(' + ')} = ${m(price.discountCents)}${price.discountCents >= price.sellCents && price.sellCents > 0 ? ' (capped at the price)' : ''}`,
    ),
    money(
      `${prefix}price:subtotal`,
      'Subtotal',
      price.subtotalCents,
      `${m(price.sellCents)} − ${m(price.discountCents)} = ${m(price.subtotalCents)}`,
    ),
  );
  const taxLabel = TAX_RULE_LABELS[pricing.taxOn];
  const rate = formatPercent(pricing.taxRatePercent, 3);
  const taxText =
    pricing.taxOn === 'none'
      ? 'No tax'
      : pricing.taxOn === 'materials-cost'
        ? `${taxLabel}: ${m(price.equipmentCostCents + price.materialsCostCents)} × ${rate} = ${m(price.contractorTaxCents)}, counted in our cost`
        : `${taxLabel}: ${m(price.taxableCents)} taxable × ${rate} = ${m(price.taxCents)}`;
  const exempt = [
    ...new Set(
      price.lineSells
        .filter((l) => !l.categoryTaxable && taxRuleCovers(pricing.taxOn, l.category))
        .map((l) => `"${l.categoryName ?? ''}"`),
    ),
  ];
  const exemptText =
    exempt.length === 0 ? '' : `; lines of ${exempt.join(', ')} are left out (not taxable in the price book)`;
  out.push(
    money(`${prefix}price:tax`, 'Tax', price.taxCents, `${taxText}${exemptText}`, {
      source: "The company's tax rule and the price book's taxable flag per category",
    }),
    money(
      `${prefix}price:total`,
      'Total',
      price.totalCents,
      `${m(price.subtotalCents)} + ${m(price.taxCents)} tax = ${m(price.totalCents)}`,
    ),
    money(
      `${prefix}price:deposit`,
      'Deposit',
      price.depositCents,
      pricing.deposit.kind === 'percent'
        ? `${m(price.totalCents)} × ${formatPercent(pricing.deposit.value, 2)} = ${m(price.depositCents)}`
        : `Fixed deposit ${m(roundHalfUp(pricing.deposit.value))}${price.depositCents < roundHalfUp(pricing.deposit.value) ? `, capped at the total ${m(price.totalCents)}` : ''}`,
    ),
    money(
      `${prefix}price:balance`,
      'Balance after deposit',
      price.balanceCents,
      `${m(price.totalCents)} − ${m(price.depositCents)} = ${m(price.balanceCents)}`,
    ),
  );
  const gm = price.subtotalCents - price.costCents;
  out.push(
    money(
      `${prefix}price:gross-margin`,
      'Gross margin',
      gm,
      `${m(price.subtotalCents)} subtotal − ${m(price.costCents)} cost = ${m(gm)}`,
    ),
    explanation({
      key: `${prefix}price:gross-margin-percent`,
      label: 'Gross margin, percent',
      value: price.grossMarginPercent,
      unit: '%',
      valueText: formatPercent(price.grossMarginPercent, 2),
      text:
        price.subtotalCents > 0
          ? `${m(gm)} ÷ ${m(price.subtotalCents)} = ${formatPercent(price.grossMarginPercent, 2)} (markup on cost ${price.costCents > 0 ? formatPercent(roundHalfUp((gm / price.costCents) * 100, 2), 2) : 'n/a'})`
          : 'No price yet',
      status: gm < 0 ? 'warning' : 'ok',
      verdict: gm < 0 ? 'Below cost: this option loses money.' : undefined,
      source: 'Gross margin = (price − cost) ÷ price',
    }),
  );
  for (const plan of plans)
    out.push(
      explainMonthlyPayment({
        key: `${prefix}price:monthly:${plan.key}`,
        planName: plan.name,
        principalCents: price.balanceCents,
        aprPercent: plan.aprPercent,
        months: plan.months,
      }),
    );
  return out;
}

/** "12 lines by their own rule, 5 by their category's, 2 at the company default". */
function lineRuleCounts(lines: readonly LineSell[]): string {
  const n = (s: LineSell['source']) => lines.filter((l) => l.source === s).length;
  const parts: string[] = [];
  const lines_ = (k: number) => `${k} line${k === 1 ? '' : 's'}`;
  if (n('item') > 0) parts.push(`${lines_(n('item'))} by their own rule`);
  if (n('category') > 0) parts.push(`${lines_(n('category'))} by their category's`);
  if (n('company') > 0) parts.push(`${lines_(n('company'))} at the company default`);
  return parts.length > 0 ? parts.join(', ') : 'no lines';
}

/** "$1,234.56" with its quantity × unit price, for a takeoff line's explanation. */
export function explainExtension({
  quantity,
  unit,
  unitCents,
  extendedCents,
}: {
  readonly quantity: number;
  readonly unit: string;
  readonly unitCents: number | null;
  readonly extendedCents: number;
}): string {
  if (unitCents === null) return `No price in the price book for this item: counted at ${formatMoney(0)}`;
  return `${formatNumber(quantity, 2, { trim: true })} ${unit} × ${formatMoney(unitCents)} = ${formatMoney(extendedCents)}`;
}
