import {
  diffSnapshots,
  type ChangeArea,
  type CustomerOption,
  type CustomerProposalView,
  type ProposalSnapshot,
  type SnapshotOption,
} from '@contract';

/**
 * The customer's view of a version (contract `customerProposalView`), picked field by field from the frozen
 * snapshot: what a homeowner is offered and nothing else (no takeoff lines, line-set and electrical
 * workings, or anything internal). Every field is named here, so a field added to the snapshot later does
 * not reach the customer unless someone adds it on purpose.
 */

type SnapshotModel = ProposalSnapshot['options'][number]['systems'][number]['outdoor'];

const model = (m: SnapshotModel) => ({
  modelNumber: m.key,
  name: m.name,
  coolingBtuh: m.nominalCoolingBtuh,
  heatingBtuh: m.nominalHeatingBtuh,
  seer2: m.seer2,
  eer2: m.eer2,
  hspf2: m.hspf2,
});

function option(o: SnapshotOption): CustomerOption {
  return {
    position: o.position,
    name: o.name,
    systems: o.systems.map((s) => ({
      name: s.name,
      outdoor: model(s.outdoor),
      zones: s.zones.map((z) => ({ name: z.name, rooms: [...z.rooms], indoor: model(z.indoor) })),
      heatKit: s.heatKit ? model(s.heatKit) : null,
    })),
    included: [...o.included],
    price: {
      beforeDiscountCents: o.price.sellCents,
      discountCents: o.price.discountCents,
      subtotalCents: o.price.subtotalCents,
      taxCents: o.price.taxCents,
      totalCents: o.price.totalCents,
      depositCents: o.price.depositCents,
      balanceCents: o.price.balanceCents,
    },
    monthly: o.monthly.map((m) => ({
      name: m.name,
      aprPercent: m.aprPercent,
      months: m.months,
      monthlyPaymentCents: m.monthlyPaymentCents,
    })),
  };
}

/** What changed is told to the customer in the areas they are shown; the takeoff's lines are the office's. */
const CUSTOMER_AREAS: ReadonlySet<ChangeArea> = new Set<ChangeArea>([
  'company',
  'customer',
  'site',
  'design',
  'rooms',
  'options',
  'equipment',
  'line sets',
  'prices',
  'terms',
  'cautions',
]);

export function customerChanges(before: ProposalSnapshot, now: ProposalSnapshot): string[] {
  return diffSnapshots(before, now)
    .filter((c) => CUSTOMER_AREAS.has(c.area))
    .map((c) => c.sentence);
}

export interface ViewInput {
  proposalId: string;
  number: number;
  issuedAt: Date;
  snapshot: ProposalSnapshot;
  previous: { number: number; issuedAt: Date; snapshot: ProposalSnapshot } | null;
  chosen: { position: number; at: Date } | null;
  pdfReady: boolean;
}

export function customerView(v: ViewInput): CustomerProposalView {
  const s = v.snapshot;
  return {
    proposalId: v.proposalId,
    version: { number: v.number, issuedAt: v.issuedAt.toISOString() },
    company: {
      name: s.company.name,
      address: s.company.address,
      phone: s.company.phone,
      email: s.company.email,
      licence: s.company.licence,
    },
    customer: { name: s.customer.name },
    site: {
      street: s.site.street,
      unit: s.site.unit,
      city: s.site.city,
      region: s.site.region,
      postalCode: s.site.postalCode,
    },
    loads: {
      method: s.design.method,
      rooms: s.loads.rooms.map((r) => ({
        name: r.name,
        floorAreaFt2: r.floorAreaFt2,
        coolingBtuh: r.coolingBtuh,
        heatingBtuh: r.heatingBtuh,
      })),
      home: {
        floorAreaFt2: s.loads.block.floorAreaFt2,
        coolingBtuh: s.loads.block.coolingBtuh,
        heatingBtuh: s.loads.block.heatingBtuh,
      },
    },
    options: s.options.map(option),
    terms: s.company.terms,
    warranty: s.company.warranty,
    cautions: [...s.cautions],
    changes: v.previous
      ? {
          sinceNumber: v.previous.number,
          sinceIssuedAt: v.previous.issuedAt.toISOString(),
          sentences: customerChanges(v.previous.snapshot, s),
        }
      : null,
    chosen: v.chosen ? { position: v.chosen.position, at: v.chosen.at.toISOString() } : null,
    pdfReady: v.pdfReady,
  };
}
