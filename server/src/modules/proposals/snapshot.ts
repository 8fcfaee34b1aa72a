import type { CatalogModel } from '@calc';
import { proposalSnapshot, type ProposalSnapshot, type SnapshotOption } from '@contract';
import type { Customer } from '../customers/customer.entity';
import type { Job } from '../jobs/job.entity';
import { designAsCalcReadsIt } from '../desk/desk-design';
import type { OptionView } from '../desk/desk.service';
import pkg from '../../../../package.json';

/** The version of the calculations a snapshot was worked out with (the product's version). */
export const CALC_VERSION: string = pkg.version;

/** The method in one statement (our words), frozen with the loads it explains. */
export const METHOD_STATEMENT =
  'These loads are an estimate worked out from the walk-through: each room’s heat gain hour by hour through a design summer day and its heat loss at the winter design temperature, following the ASHRAE Handbook—Fundamentals. The whole-home (block) load is the hour when all rooms together need the most cooling.';

/** The cautions every proposal carries (DESIGN.md): the figures guide the work, the maker and the code decide it. */
export const PROPOSAL_CAUTIONS = [
  'Refrigerant charge, line sizes and electrical figures are estimates; the installer follows the equipment maker’s installation instructions, the local codes and licensed practice.',
  'Refrigerant work is done only by technicians certified under EPA Section 608.',
];

interface SnapshotInputs {
  /** The company's part as the settings hold it now (company-settings `proposalCompanyPart`): frozen here. */
  readonly company: ProposalSnapshot['company'];
  readonly customer: Pick<Customer, 'name' | 'email' | 'phone'>;
  readonly job: Pick<Job, 'street' | 'unit' | 'city' | 'region' | 'postalCode' | 'designConditions' | 'designSources'>;
  readonly options: readonly OptionView[];
  readonly issuedAt: Date;
}

const modelOf = (key: string, models: Record<string, CatalogModel>) => {
  const m = models[key];
  return {
    key,
    name: m?.name ?? key,
    kind: m?.kind ?? 'unknown',
    nominalCoolingBtuh: m?.nominalCoolingBtuh ?? null,
    nominalHeatingBtuh: m?.nominalHeatingBtuh ?? null,
    seer2: m?.seer2 ?? null,
    eer2: m?.eer2 ?? null,
    hspf2: m?.hspf2 ?? null,
  };
};

/** One option's frozen part, from calc's figures for it (the desk's computeOption on the saved inputs). */
function optionOf(v: OptionView): SnapshotOption {
  const f = v.computed.figures;
  if (!f) throw new Error(`option ${v.option.id} has no figures`);
  const models = v.option.chosenModels;
  const d = f.design;
  const roomNames = new Map(d.loads.rooms.map((r) => [r.roomId, r.roomName]));
  const zones = new Map(d.zones.map((z) => [z.zoneKey, z]));
  const sells = new Map(f.price.lineSells.map((l) => [l.itemKey, l.sellCents]));
  // The design as calc worked it out (defaults filled): an absent condensate run is calc's 10 ft, not 0.
  const design = v.option.design ? designAsCalcReadsIt(v.option.design) : null;
  return {
    position: v.option.position,
    name: v.option.name,
    systems: d.systems.map((s) => {
      const input = design?.systems.find((x) => x.key === s.systemKey);
      const zoneKeys = s.refrigerant.circuits.map((c) => c.zoneKey);
      return {
        key: s.systemKey,
        name: s.name,
        outdoor: modelOf(s.outdoorUnitKey, models),
        zones: (zoneKeys.length ? zoneKeys : (input?.circuits.map((c) => c.zoneKey) ?? []))
          .map((k) => zones.get(k))
          .filter((z) => z !== undefined)
          .map((z) => ({
            key: z.zoneKey,
            name: z.name,
            rooms: z.roomIds.map((id) => roomNames.get(id) ?? id),
            indoor: modelOf(z.indoorUnitKey, models),
            coolingLoadBtuh: z.sizing.coolingLoadBtuh,
            heatingLoadBtuh: z.sizing.heatingLoadBtuh,
          })),
        refrigerant: s.refrigerant.refrigerant ?? '',
        lineSets: s.refrigerant.circuits.map((c) => ({
          zoneKey: c.zoneKey,
          zoneName: zones.get(c.zoneKey)?.name ?? c.zoneKey,
          liquid: c.liquidLabel,
          suction: c.suctionLabel,
          lengthFt: c.lengthFt,
          installedLengthFt: c.installedLengthFt,
          kind: c.lineSet,
          extraChargeOz: c.extraChargeOz,
          liftFt: c.liftFt,
          // calc's worked formula for this circuit's extra charge (its explanation key ends with the zone's key).
          extraChargeText:
            s.refrigerant.explanations.find((e) => e.key.endsWith(`charge:${c.zoneKey}`))?.text.slice(0, 600) ?? '',
          condensate: {
            kind: input?.circuits.find((x) => x.zoneKey === c.zoneKey)?.condensate ?? 'gravity',
            lengthFt: input?.circuits.find((x) => x.zoneKey === c.zoneKey)?.condensateLengthFt ?? 0,
          },
        })),
        extraChargeOz: s.refrigerant.extraChargeOz,
        totalChargeOz: s.refrigerant.totalChargeOz,
        electrical: {
          supplyVoltage: s.electrical.supplyVoltage,
          mcaA: s.electrical.mcaA,
          mocpA: s.electrical.mocpA,
          breakerA: s.electrical.breakerA,
          wireAwg: s.electrical.wireAwg,
          circuitLengthFt: s.electrical.circuitLengthFt,
          disconnectA: s.electrical.disconnectA,
        },
        heatKit: s.heatKitKey ? modelOf(s.heatKitKey, models) : null,
      };
    }),
    included: [
      ...f.lines.filter((l) => l.category !== 'labor').map((l) => l.description),
      ...f.lines.filter((l) => l.category === 'labor').map((l) => l.description),
    ],
    takeoff: f.lines.map((l) => ({
      itemKey: l.itemKey,
      description: l.description,
      quantity: l.quantity,
      unit: l.unit,
      category: l.category,
      sellCents: l.sell?.sellCents ?? sells.get(l.itemKey) ?? 0,
    })),
    price: {
      sellCents: f.price.sellCents,
      discountCents: f.price.discountCents,
      subtotalCents: f.price.subtotalCents,
      taxCents: f.price.taxCents,
      totalCents: f.price.totalCents,
      depositCents: f.price.depositCents,
      balanceCents: f.price.balanceCents,
    },
    monthly: f.monthly.map((m) => ({
      name: m.name,
      aprPercent: m.aprPercent,
      months: m.months,
      monthlyPaymentCents: m.monthlyPaymentCents,
    })),
  };
}

/**
 * The snapshot of a version: everything the customer is offered, from calc's figures on the saved inputs
 * (never from a browser), checked against the contract's schema before it is stored.
 */
export function buildSnapshot(i: SnapshotInputs): ProposalSnapshot {
  const options = i.options.map(optionOf);
  // The loads as the first option's design shows them (the desk's loads for its plan; every option shares the rooms).
  const loads = i.options[0]?.computed.figures?.design.loads;
  if (!loads) throw new Error('a proposal needs at least one option with figures');
  const cautions = [
    ...new Set([...PROPOSAL_CAUTIONS, ...i.options.flatMap((o) => o.computed.figures?.design.cautions ?? [])]),
  ];
  return proposalSnapshot.parse({
    schema: 1,
    company: { ...i.company },
    customer: { name: i.customer.name, email: i.customer.email ?? null, phone: i.customer.phone ?? null },
    site: {
      street: i.job.street,
      unit: i.job.unit,
      city: i.job.city,
      region: i.job.region,
      postalCode: i.job.postalCode,
    },
    design: {
      conditions: { ...(i.job.designConditions ?? {}) },
      sources: { ...i.job.designSources },
      method: METHOD_STATEMENT,
    },
    loads: {
      rooms: loads.rooms.map((r) => ({
        roomId: r.roomId,
        name: r.roomName,
        floorAreaFt2: r.floorAreaFt2,
        sensibleBtuh: r.sensibleGain.total,
        latentBtuh: r.latentGain.total,
        coolingBtuh: r.coolingTotalBtuh,
        heatingBtuh: r.heatLoss.total,
      })),
      block: {
        hour: loads.block.hour,
        sensibleBtuh: loads.block.sensibleBtuh,
        latentBtuh: loads.block.latentBtuh,
        coolingBtuh: loads.block.coolingBtuh,
        heatingBtuh: loads.totals.heatingBtuh,
        floorAreaFt2: loads.totals.floorAreaFt2,
      },
    },
    options,
    cautions,
    calcVersion: CALC_VERSION,
    issuedAt: i.issuedAt.toISOString(),
  });
}
