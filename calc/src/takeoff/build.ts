import type { ElectricalPlan } from '../electrical/plan';
import { branchConductors, racewaySize } from '../electrical/raceway';
import type { CircuitCharge, RefrigerantPlan } from '../refrigerant/circuits';
import { roundHalfUp, roundUpTo } from '../rounding';
import type { Circuit, System } from '../schemas/design';
import type { HeatKit, IndoorUnit, OutdoorUnit } from '../schemas/equipment';
import { OZ_PER_LB } from '../units';
import { LABOR_HOURS, TAKEOFF_DEFAULTS } from './defaults';
import type { TakeoffLine } from './lines';

/** What the takeoff needs to know about one system. */
export interface SystemForTakeoff {
  readonly system: System;
  readonly outdoor: OutdoorUnit;
  readonly indoorByZone: ReadonlyMap<string, IndoorUnit>;
  readonly refrigerant: RefrigerantPlan;
  readonly electrical: ElectricalPlan;
  readonly heatKit?: HeatKit | undefined;
  readonly heatKitElectrical?: ElectricalPlan | null | undefined;
}

/** Lines with the same item key merged as they are produced (one key, one group). */
interface LineGroup {
  readonly itemKey: string;
  readonly description: string;
  readonly unit: TakeoffLine['unit'];
  readonly category: TakeoffLine['category'];
  quantity: number;
  readonly derivations: string[];
}

/**
 * Collects takeoff lines merged by item key on the fly, with exactly the result of
 * collecting every line and calling `mergeLines` (first-seen order and fields, quantities
 * added in line order and rounded half-up to 0.01 when merged, derivations joined with
 * "; "), without building the intermediate per-line objects.
 */
class LineMerger {
  private readonly groups = new Map<string, LineGroup>();

  add(
    itemKey: string,
    description: string,
    quantity: number,
    unit: TakeoffLine['unit'],
    category: TakeoffLine['category'],
    derivation: string,
  ): void {
    const g = this.groups.get(itemKey);
    if (g) {
      g.quantity += quantity;
      g.derivations.push(derivation);
    } else {
      this.groups.set(itemKey, { itemKey, description, unit, category, quantity, derivations: [derivation] });
    }
  }

  /** A material line. */
  mat(itemKey: string, description: string, quantity: number, unit: TakeoffLine['unit'], derivation: string): void {
    this.add(itemKey, description, quantity, unit, 'material', derivation);
  }

  /** A labor line, hours rounded half-up to 0.01 h. */
  labor(itemKey: string, description: string, hours: number, derivation: string): void {
    this.add(itemKey, description, roundHalfUp(hours, 2), 'h', 'labor', derivation);
  }

  lines(): TakeoffLine[] {
    const out: TakeoffLine[] = [];
    for (const g of this.groups.values()) {
      const merged = g.derivations.length > 1;
      out.push({
        itemKey: g.itemKey,
        description: g.description,
        quantity: merged ? roundHalfUp(g.quantity, 2) : g.quantity,
        unit: g.unit,
        category: g.category,
        derivation: merged ? g.derivations.join('; ') : (g.derivations[0] ?? ''),
      });
    }
    return out;
  }
}

/** Shortest stock kit ≥ length, or null when the run is longer than every kit. */
export function stockKitLengthFt({ lengthFt }: { readonly lengthFt: number }): number | null {
  return TAKEOFF_DEFAULTS.lineSetKitLengthsFt.find((k) => k >= lengthFt) ?? null;
}

/** Whole cylinders to buy for an extra charge, oz → ceil(lb / cylinder lb). 0 when nothing is added. */
export function cylindersToBuy({
  extraOz,
  cylinderLb,
}: {
  readonly extraOz: number;
  readonly cylinderLb: number;
}): number {
  return extraOz <= 0 ? 0 : Math.ceil(extraOz / OZ_PER_LB / cylinderLb - 1e-9);
}

const MOUNT_LABOR: Record<IndoorUnit['unitType'], number> = {
  'wall-head': LABOR_HOURS.mountWallHead,
  'ceiling-cassette': LABOR_HOURS.mountCassette,
  'floor-console': LABOR_HOURS.mountFloorConsole,
  'ducted-air-handler': LABOR_HOURS.mountAirHandler,
};
const MOUNT_DESCRIPTION: Record<IndoorUnit['unitType'], string> = {
  'wall-head': 'Mount indoor unit (wall-head)',
  'ceiling-cassette': 'Mount indoor unit (ceiling-cassette)',
  'floor-console': 'Mount indoor unit (floor-console)',
  'ducted-air-handler': 'Mount indoor unit (ducted-air-handler)',
};

/*
 * Derivation text: the parts that only depend on the defaults are built once here, so a
 * line's text is its own numbers plus these pieces and the circuit's "(system, zone)" suffix.
 */
const T = TAKEOFF_DEFAULTS;
const L = LABOR_HOURS;
const CABLE_SLACK_TEXT = ` ft + ${T.cableSlackFt} ft slack, rounded up to 5 ft`;
const LINE_COVER_PIECE_TEXT = ` ft ÷ ${T.lineCoverPieceFt} ft, rounded up`;
const LINE_COVER_DESCRIPTION = `Line cover ${T.lineCoverPieceFt} ft section`;
const LINE_COVER_LABOR_TEXT = ` ft × ${L.lineCoverPerFt} h/ft`;
const LINE_SET_LABOR_TEXT = [`${L.lineSetBase} h + `, ` ft × ${L.lineSetPerFt} h/ft`] as const;
const WALL_PENETRATION_LABOR_TEXT = ` × ${L.wallPenetration} h`;
const ELECTRICAL_LABOR_TEXT = [`${L.electricalBase} h + `, ` ft × ${L.electricalPerFt} h/ft`] as const;
const CHARGE_STARTUP_TEXT = [`${L.chargeStartupBase} h + `, ` circuit(s) × ${L.chargeStartupPerCircuit} h`] as const;

/** Materials and labor lines for one circuit of a system (indoor unit, line set, accessories, labor), added to `out`. */
function circuitLines(
  name: string,
  c: Circuit,
  indoor: IndoorUnit,
  plan: CircuitCharge,
  heatPump: boolean,
  out: LineMerger,
): void {
  const at = ` (${name}, zone ${c.zoneKey})`;
  out.add(
    `equipment:${indoor.key}`,
    indoor.description,
    1,
    'each',
    'equipment',
    `indoor unit for ${name}, zone ${c.zoneKey}`,
  );
  // The refrigerant plan decided kit or field-cut (and the kit's length), so the charge and the purchase agree.
  const kit = plan.lineSet === 'kit' ? plan.kitLengthFt : null;
  if (kit !== null) {
    out.mat(
      `line-set-kit:${plan.liquidLabel}x${plan.suctionLabel}:${kit}ft`,
      `Insulated line-set kit ${plan.liquidLabel} × ${plan.suctionLabel} in, ${kit} ft`,
      1,
      'each',
      `${c.lengthFt} ft run rounded up to the ${kit} ft stock kit${at}`,
    );
  } else {
    const ft = roundUpTo(c.lengthFt, 5);
    out.mat(
      `copper-acr:${plan.liquidLabel}`,
      `ACR copper ${plan.liquidLabel} in, coil`,
      ft,
      'ft',
      `${c.lengthFt} ft run, field-cut copper rounded up to 5 ft${at}`,
    );
    out.mat(
      `copper-acr:${plan.suctionLabel}`,
      `ACR copper ${plan.suctionLabel} in, coil`,
      ft,
      'ft',
      `same run, suction line${at}`,
    );
    out.mat(
      `pipe-insulation:${plan.suctionLabel}`,
      `Pipe insulation for ${plan.suctionLabel} in`,
      ft,
      'ft',
      `suction line insulation${at}`,
    );
    // A heat pump's liquid line runs hot in heating and cold in cooling: both lines are insulated [TRADE; issue 9].
    if (heatPump)
      out.mat(
        `pipe-insulation:${plan.liquidLabel}`,
        `Pipe insulation for ${plan.liquidLabel} in`,
        ft,
        'ft',
        `liquid line insulation (heat pump)${at}`,
      );
  }
  out.mat('insulation-tape', 'Insulation tape for joints', 1, 'roll', `one roll per circuit${at}`);
  out.mat(
    'comm-cable:14-4',
    'Communication cable 14/4 stranded',
    roundUpTo(c.lengthFt + T.cableSlackFt, T.cableStepFt),
    'ft',
    `${c.lengthFt}${CABLE_SLACK_TEXT}${at}`,
  );
  if (c.wallPenetrations > 0)
    out.mat(
      'wall-sleeve',
      'Wall sleeve with cap',
      c.wallPenetrations,
      'each',
      `${c.wallPenetrations} wall penetration(s)${at}`,
    );
  if (c.lineCoverFt > 0) {
    const pieces = Math.ceil(c.lineCoverFt / T.lineCoverPieceFt - 1e-9);
    out.mat(
      'line-cover:straight',
      LINE_COVER_DESCRIPTION,
      pieces,
      'each',
      `${c.lineCoverFt}${LINE_COVER_PIECE_TEXT}${at}`,
    );
    out.mat('line-cover:wall-inlet', 'Line cover wall inlet', 1, 'each', `one per covered run${at}`);
    out.labor(
      'labor:line-cover',
      'Install line cover',
      c.lineCoverFt * L.lineCoverPerFt,
      `${c.lineCoverFt}${LINE_COVER_LABOR_TEXT}${at}`,
    );
  }
  const pump = c.condensate === 'pump' || indoor.needsCondensatePump;
  if (pump) out.mat('condensate-pump', 'Condensate pump', 1, 'each', `pump drain${at}`);
  if (c.condensateLengthFt > 0) {
    out.mat(
      'condensate-line:3/4',
      'Condensate line 3/4 in',
      roundUpTo(c.condensateLengthFt, T.condensateStepFt),
      'ft',
      `${c.condensateLengthFt} ft rounded up to 10 ft${at}`,
    );
  }
  out.mat('fasteners:kit', 'Fastener and strap kit', 1, 'each', `one per circuit${at}`);
  const laborTable = `labor table${at}`;
  out.labor('labor:mount-indoor', MOUNT_DESCRIPTION[indoor.unitType], MOUNT_LABOR[indoor.unitType], laborTable);
  out.labor(
    'labor:run-line-set',
    'Run, flare/braze and support line set',
    L.lineSetBase + c.lengthFt * L.lineSetPerFt,
    `${LINE_SET_LABOR_TEXT[0]}${c.lengthFt}${LINE_SET_LABOR_TEXT[1]}${at}`,
  );
  if (c.wallPenetrations > 0)
    out.labor(
      'labor:wall-penetration',
      'Core wall penetration',
      c.wallPenetrations * L.wallPenetration,
      `${c.wallPenetrations}${WALL_PENETRATION_LABOR_TEXT}${at}`,
    );
  out.labor(
    pump ? 'labor:condensate-pump' : 'labor:condensate-gravity',
    pump ? 'Condensate pump and line' : 'Gravity condensate line',
    pump ? L.condensatePump : L.condensateGravity,
    laborTable,
  );
}

const WIRING_LABEL: Record<System['electrical']['wiringMethod'], string> = {
  'nm-b': 'NM-B',
  'uf-b': 'UF-B',
  'thhn-conduit': 'THHN in conduit',
};

/**
 * The branch circuit's wire by its conductors: two hots and an equipment ground (a 240 V-class circuit).
 * Cable (NM-B, UF-B) holds all three: one cable the length of the run. THHN in conduit: each conductor
 * the length of the run, so 2 × the hots' size and 1 × the ground's (NEC Table 250.122), and the EMT
 * that carries them, sized by fill and sold by the 10 ft length. Every length is the run plus a
 * termination allowance at both ends, plus waste, rounded up to 5 ft (common practice).
 */
function branchWiring(
  why: string,
  awg: number,
  ocpdA: number,
  wiring: System['electrical'],
  name: string,
  out: LineMerger,
): void {
  const run = wiring.circuitLengthFt;
  const each = run + 2 * T.terminationAllowanceFtPerEnd;
  const waste = 1 + T.wireWastePercent / 100;
  const lengthText = `(${run} ft run + 2 × ${T.terminationAllowanceFtPerEnd} ft terminations) × ${waste} waste`;
  const set = branchConductors({ awg, ocpdA });
  const method = wiring.wiringMethod;
  if (method !== 'thhn-conduit') {
    const ft = roundUpTo(roundHalfUp(each * waste, 2), T.cableStepFt);
    out.mat(
      `wire:${method}:${awg}awg`,
      `${awg}/2 with ground copper cable, ${WIRING_LABEL[method]}`,
      ft,
      'ft',
      `${why}; 1 cable (2 × ${awg} AWG + ground) × ${lengthText} = ${roundHalfUp(each * waste, 2)} ft, rounded up to 5 ft (${name})`,
    );
    return;
  }
  const conductorFt = (count: number) => roundUpTo(roundHalfUp(count * each * waste, 2), T.cableStepFt);
  out.mat(
    `wire:thhn-conduit:${awg}awg`,
    `${awg} AWG copper THHN`,
    conductorFt(set.hot.count),
    'ft',
    `${why}; ${set.hot.count} conductors × ${lengthText} = ${roundHalfUp(set.hot.count * each * waste, 2)} ft, rounded up to 5 ft (${name})`,
  );
  out.mat(
    `wire:thhn-conduit-ground:${set.ground.awg}awg`,
    `${set.ground.awg} AWG copper THHN, green (equipment ground)`,
    conductorFt(set.ground.count),
    'ft',
    `equipment ground for a ${ocpdA} A breaker → ${set.ground.awg} AWG (NEC Table 250.122); ${set.ground.count} conductor × ${lengthText} = ${roundHalfUp(set.ground.count * each * waste, 2)} ft, rounded up to 5 ft (${name})`,
  );
  const emt = racewaySize({ kind: 'emt', set });
  out.mat(
    `raceway:emt:${emt.size}`,
    `EMT ${emt.size} in`,
    roundUpTo(run, T.emtStickFt),
    'ft',
    `${emt.text}; ${run} ft run, rounded up to ${T.emtStickFt} ft lengths (${name})`,
  );
}

/** Materials and labor lines for one system (equipment, line sets, accessories, electrical, refrigerant, labor), added to `out`. */
function systemLines(s: SystemForTakeoff, out: LineMerger): void {
  const name = s.system.name;
  out.add(`equipment:${s.outdoor.key}`, s.outdoor.description, 1, 'each', 'equipment', `outdoor unit of ${name}`);
  const circuits = s.system.circuits;
  const heatPump = s.outdoor.equipmentType.startsWith('heat-pump');
  for (let i = 0; i < circuits.length; i += 1) {
    const c = circuits[i];
    const indoor = c && s.indoorByZone.get(c.zoneKey);
    const plan = s.refrigerant.circuits[i];
    if (c && indoor && plan) circuitLines(name, c, indoor, plan, heatPump, out);
  }
  const bracket = s.system.mounting === 'wall-bracket';
  out.mat(
    bracket ? 'mount:wall-bracket' : 'mount:pad',
    bracket ? 'Outdoor unit wall bracket' : 'Outdoor unit pad',
    1,
    'each',
    `${name} mounting`,
  );
  out.labor(
    'labor:set-outdoor',
    'Set outdoor unit',
    bracket ? L.setOutdoorBracket : L.setOutdoorPad,
    `labor table (${name})`,
  );
  const e = s.electrical;
  const wiring = s.system.electrical;
  const disconnectA = (e.breakerA ?? e.mocpA) <= 60 ? 60 : 100;
  out.mat(
    `disconnect:${disconnectA}a`,
    `AC disconnect, ${disconnectA} A non-fused`,
    1,
    'each',
    `within sight of ${name}; breaker ${e.breakerA ?? '?'} A`,
  );
  if (e.breakerA !== null && e.wireAwg !== null) {
    const set = branchConductors({ awg: e.wireAwg, ocpdA: e.breakerA });
    const whip = racewaySize({ kind: 'lfmc', set });
    out.mat(
      `whip:${whip.size}x${T.whipLengthFt}ft`,
      `Liquid-tight whip ${whip.size} in × ${T.whipLengthFt} ft`,
      1,
      'each',
      `disconnect to unit; ${whip.text} (${name})`,
    );
  }
  if (e.breakerA !== null)
    out.mat(
      `breaker:2p-${e.breakerA}a`,
      `2-pole breaker ${e.breakerA} A`,
      1,
      'each',
      `largest standard rating ≤ MOCP ${e.mocpA} A and ≥ MCA ${e.mcaA} A (${name})`,
    );
  if (e.wireAwg !== null && e.breakerA !== null)
    branchWiring(
      `MCA ${e.mcaA} A → ${e.wireAwg} AWG at ${e.ampacityColumnC} °C`,
      e.wireAwg,
      e.breakerA,
      wiring,
      name,
      out,
    );
  out.labor(
    'labor:electrical',
    'Branch circuit, disconnect and whip',
    L.electricalBase + wiring.circuitLengthFt * L.electricalPerFt,
    `${ELECTRICAL_LABOR_TEXT[0]}${wiring.circuitLengthFt}${ELECTRICAL_LABOR_TEXT[1]} (${name})`,
  );
  if (s.heatKit) {
    out.add(`equipment:${s.heatKit.key}`, s.heatKit.description, 1, 'each', 'equipment', `backup heat for ${name}`);
    const k = s.heatKitElectrical;
    if (k && k.breakerA !== null)
      out.mat(
        `breaker:2p-${k.breakerA}a`,
        `2-pole breaker ${k.breakerA} A`,
        1,
        'each',
        `heat kit circuit, MOCP ${k.mocpA} A (${name})`,
      );
    if (k && k.wireAwg !== null && k.breakerA !== null)
      branchWiring(
        `heat kit MCA ${k.mcaA} A → ${k.wireAwg} AWG`,
        k.wireAwg,
        k.breakerA,
        wiring,
        `${name}, heat kit`,
        out,
      );
  }
  // Refrigerant is priced by the pound put in (issue 9); the cylinder it comes from is the company's stock item.
  const r = s.refrigerant;
  if (r.extraChargeOz > 0) {
    const lb = roundHalfUp(r.extraChargeOz / OZ_PER_LB, 2);
    out.mat(
      `refrigerant:${r.refrigerant}`,
      `${r.refrigerant} refrigerant added on site`,
      lb,
      'lb',
      `${r.extraChargeOz} oz extra charge ÷ 16 oz/lb = ${lb} lb (${name})`,
    );
  }
  out.mat('nitrogen:test', 'Dry nitrogen for pressure test and purge', 1, 'each', `one test per system (${name})`);
  out.labor(
    'labor:pressure-test-evacuate',
    'Pressure test and evacuation',
    L.pressureTestEvacuate,
    `labor table (${name})`,
  );
  const count = circuits.length;
  out.labor(
    'labor:charge-startup',
    'Charge and start-up',
    L.chargeStartupBase + count * L.chargeStartupPerCircuit,
    `${CHARGE_STARTUP_TEXT[0]}${count}${CHARGE_STARTUP_TEXT[1]} (${name})`,
  );
}

/** The full takeoff for a design: every system's lines, merged by item key (quantities summed). */
export function buildTakeoff({ systems }: { readonly systems: readonly SystemForTakeoff[] }): TakeoffLine[] {
  const out = new LineMerger();
  for (const s of systems) systemLines(s, out);
  return out.lines();
}
