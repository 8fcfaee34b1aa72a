import {
  maySeeCost,
  maySeePrice,
  type DeskResponse,
  type OptionPriceRecord,
  type OptionRecord,
  type OptionResultRecord,
  type ReadyOverride,
  type Role,
  type TakeoffLineRecord,
} from '@contract';
import type { OptionPrice } from '@calc';
import type { DeskLine, OptionFigures } from './desk-compute';
import { designAsCalcReadsIt } from './desk-design';
import { keyOf } from './desk-read';
import type { DeskView, OptionView } from './desk.service';

const person = (u: { id: string; name: string } | null | undefined) => (u ? { id: u.id, name: u.name } : null);

/** The price as the role may see it: the office everything; salespeople the customer's figures; installers nothing. */
function presentPrice(f: OptionFigures, role: Role): OptionPriceRecord | null {
  if (!maySeePrice(role)) return null;
  const p: OptionPrice = f.price;
  const out: OptionPriceRecord = {
    sellCents: p.sellCents,
    discountCents: p.discountCents,
    discountPercent: f.discountPercent,
    subtotalCents: p.subtotalCents,
    taxableCents: p.taxableCents,
    taxCents: p.taxCents,
    totalCents: p.totalCents,
    depositCents: p.depositCents,
    balanceCents: p.balanceCents,
    monthlyPaymentCents: p.monthlyPaymentCents,
  };
  if (!maySeeCost(role)) return out;
  return {
    ...out,
    equipmentCostCents: p.equipmentCostCents,
    materialsCostCents: p.materialsCostCents,
    laborCostCents: p.laborCostCents,
    costCents: p.costCents,
    grossMarginCents: p.subtotalCents - p.costCents,
    grossMarginPercent: p.grossMarginPercent,
    sellRule: f.sellRule,
    sellRulesBy: p.sellRulesBy,
  };
}

function presentLine(l: DeskLine, role: Role): TakeoffLineRecord {
  const base = {
    itemKey: l.itemKey,
    description: l.description,
    unit: l.unit,
    category: l.category,
    derivation: l.derivation,
    quantity: l.quantity,
    generatedQuantity: l.generated?.quantity ?? null,
    edited: l.edited,
    source: l.source,
  };
  if (!maySeeCost(role)) return base;
  return {
    ...base,
    unitCostCents: l.unitCostCents,
    generatedUnitCostCents: l.generated?.unitCostCents ?? null,
    extendedCostCents: l.extendedCostCents,
    ...(l.sell
      ? {
          sellCents: l.sell.sellCents,
          sellRule: {
            method: l.sell.rule.method,
            percent: l.sell.rule.percent,
            source: l.sell.source,
            from: l.sell.from,
          },
          taxed: l.sell.taxed,
        }
      : {}),
  };
}

/**
 * The price explanations a salesperson may read: the customer's figures, not the cost or the sell rule
 * (each line's sell price, `sell:<item>`, shows its cost and rule, and its tax treatment `tax:<item>`: office only).
 */
const CUSTOMER_PRICE_KEYS = /^price:(discount|subtotal|tax|total|deposit|balance|monthly:.*)$/;

function explanationsFor(f: OptionFigures, role: Role) {
  if (maySeeCost(role)) return f.explanations.map((e) => ({ ...e }));
  return f.explanations
    .filter((e) =>
      e.key.startsWith('sell:') || e.key.startsWith('tax:')
        ? false
        : e.key.startsWith('price:')
          ? maySeePrice(role) && CUSTOMER_PRICE_KEYS.test(e.key)
          : true,
    )
    .map((e) => ({ ...e }));
}

function presentResult(v: OptionView, role: Role): OptionResultRecord | null {
  const f = v.computed.figures;
  if (!f) return null;
  return {
    zones: f.design.zones.map((z) => ({ ...z })),
    systems: f.design.systems.map((s) => ({ ...s })),
    takeoff: f.lines.map((l) => presentLine(l, role)),
    price: presentPrice(f, role),
    monthly: maySeePrice(role) ? f.monthly : [],
    discontinued: v.computed.discontinued,
    explanations: explanationsFor(f, role),
    preliminaryRange:
      f.range && maySeePrice(role)
        ? {
            lowCents: f.range.lowCents,
            highCents: f.range.highCents,
            text: f.range.text,
            note: f.range.note,
            preliminary: true,
          }
        : null,
    // calc's pricing warnings name the price book's gaps (no cost for an item): the office's business.
    warnings: maySeeCost(role)
      ? [...f.design.warnings]
      : f.design.warnings.filter((w) => !w.startsWith('No price for')),
    cautions: [...f.design.cautions],
    isEstimate: true,
  };
}

/** The only shape an option leaves the server in, by role (installers: no cost, margin, discount or price). */
export function presentOption(v: OptionView, role: Role): OptionRecord {
  const o = v.option;
  const office = maySeeCost(role);
  const priced = maySeePrice(role);
  const pricing = priced
    ? office
      ? { ...o.pricing }
      : { discounts: o.pricing.discounts, deposit: o.pricing.deposit, financingPlanKey: o.pricing.financingPlanKey }
    : null;
  return {
    id: o.id,
    jobId: o.job.id,
    position: o.position,
    name: o.name,
    // As calc reads it (defaults filled): what the GET returns saved back unchanged stores the same design.
    design: o.design ? { ...designAsCalcReadsIt(o.design) } : null,
    pricing,
    takeoffEdits: office
      ? v.computed.edits.map((e) => ({
          key: e.key,
          edit: { ...e.stored },
          stale: e.stale
            ? { reason: e.stale.reason, message: e.stale.message, before: e.stale.before, now: e.stale.now }
            : null,
        }))
      : [],
    discountRequest: priced ? (o.discountRequest ?? null) : null,
    preliminary: o.preliminary,
    reviewedBy: person(o.reviewedBy),
    reviewedAt: o.reviewedAt ? o.reviewedAt.toISOString() : null,
    result: presentResult(v, role),
    problems: v.computed.problems,
    blockers: priced ? v.computed.blockers : v.computed.blockers.filter((b) => b.code !== 'discount-pending'),
    version: o.version,
    createdBy: person(o.createdBy),
    createdAt: o.createdAt.toISOString(),
    updatedAt: o.updatedAt.toISOString(),
  };
}

/**
 * A sizing verdict the office chose to propose anyway says so in its explanation: who, when and why
 * (the same words wherever the explanation is shown).
 */
function withOverride(o: OptionRecord, override: ReadyOverride | null): OptionRecord {
  if (!override || !o.result) return o;
  const note = `Proposed anyway by ${override.by.name} on ${override.at.slice(0, 10)}: “${override.reason}”`;
  const annotate = (list: unknown): unknown => {
    if (!Array.isArray(list)) return list;
    return list.map((e: { key?: unknown; status?: unknown; verdict?: unknown }) => {
      const verdict = e.verdict;
      if (typeof e.key !== 'string' || !e.key.endsWith('cooling-ratio') || e.status !== 'warning') return e;
      if (typeof verdict !== 'string' || !override.units.some((u) => u.includes(verdict))) return e;
      return { ...e, verdict: `${verdict}. ${note}`, override: { ...override, by: { ...override.by } } };
    });
  };
  const r = o.result;
  return {
    ...o,
    result: {
      ...r,
      zones: r.zones.map((z) => ({ ...z, explanations: annotate(z['explanations']) })),
      systems: r.systems.map((y) => ({ ...y, explanations: annotate(y['explanations']) })),
    },
  };
}

/** The ready override the desk's explanations carry (only while the job is marked ready). */
const overrideOf = (v: DeskView) => (v.desk.job.readyAt ? (v.desk.job.readyOverride ?? null) : null);

export function presentDesk(v: DeskView, role: Role): DeskResponse {
  const job = v.desk.job;
  const blockers = maySeePrice(role) ? v.blockers : v.blockers.filter((b) => b.code !== 'discount-pending');
  const override = overrideOf(v);
  // Ready: marked, and nothing blocks it but the units outside their sizing range the office's reason covers.
  const uncovered = v.blockers.filter(
    (b) => !(b.code === 'sizing-outside-range' && override?.units.includes(b.message) === true),
  );
  return {
    jobId: job.id,
    jobStatus: job.status,
    options: v.options.map((o) => withOverride(presentOption(o, role), override)),
    readiness: {
      markedReady:
        job.readyAt && job.readyBy
          ? { at: job.readyAt.toISOString(), by: { id: job.readyBy.id, name: job.readyBy.name } }
          : null,
      sizingOverride: override ? { ...override, by: { ...override.by }, units: [...override.units] } : null,
      ready: Boolean(job.readyAt) && uncovered.length === 0,
      blockers,
    },
  };
}

/**
 * GET …/desk as bytes: exactly `JSON.stringify(presentDesk(v, role))`, each option's part from `keep` under a
 * key of everything its presentation reads — the figures' key (every input the figures are worked out from),
 * the role, the option's row (position, version, times, people) and the job's ready override — so an option
 * whose key was seen before is not presented, serialised and encoded again (tests/server/desk-read.test.ts
 * holds the bytes to presentDesk's).
 */
export function presentDeskBytes(v: DeskView, role: Role, keep: (key: string, make: () => Buffer) => Buffer): Buffer {
  const override = overrideOf(v);
  const shell = presentDesk({ ...v, options: [] }, role);
  const parts = v.options.map((o) => {
    const make = () => Buffer.from(JSON.stringify(withOverride(presentOption(o, role), override)));
    if (!o.key) return make();
    const r = o.option;
    const iso = (d: Date | null | undefined) => (d ? d.toISOString() : null);
    const row = [r.job.id, r.position, r.version, iso(r.createdAt), iso(r.updatedAt), iso(r.reviewedAt)];
    return keep(`${o.key}|${keyOf([role, row, person(r.createdBy), person(r.reviewedBy), override])}`, make);
  });
  const out: Buffer[] = [];
  let sep = '{';
  for (const [k, value] of Object.entries(shell)) {
    if (value === undefined) continue;
    out.push(Buffer.from(`${sep}${JSON.stringify(k)}:`));
    sep = ',';
    if (k !== 'options') {
      out.push(Buffer.from(JSON.stringify(value)));
      continue;
    }
    out.push(Buffer.from('['));
    parts.forEach((p, i) => out.push(...(i ? [Buffer.from(','), p] : [p])));
    out.push(Buffer.from(']'));
  }
  out.push(Buffer.from(sep === '{' ? '{}' : '}'));
  return Buffer.concat(out);
}
