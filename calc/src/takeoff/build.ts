import type { ElectricalPlan } from '../electrical/plan';
import { branchConductors, racewaySize } from '../electrical/raceway';
import type { CircuitCharge, RefrigerantPlan } from '../refrigerant/circuits';
import { roundHalfUp, roundUpTo } from '../rounding';
import type { Circuit, System } from '../schemas/design';
import type { HeatKit, IndoorUnit, OutdoorUnit } from '../schemas/equipment';
import { OZ_PER_LB } from '../units';
import { DEFAULT_LABOR_TABLE, TAKEOFF_DEFAULTS, type LaborHoursKey, type LaborTable } from './defaults';
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

/** Which entry of the labor table mounts each kind of indoor unit. */
const MOUNT_LABOR: Record<IndoorUnit['unitType'], LaborHoursKey> = {
  'wall-head': 'mountWallHead',
  'ceiling-cassette': 'mountCassette',
  'floor-console': 'mountFloorConsole',
  'slim-ducted': 'mountSlimDucted',
  'ducted-air-handler': 'mountAirHandler',
};
const MOUNT_DESCRIPTION: Record<IndoorUnit['unitType'], string> = {
  'wall-head': 'Mount indoor unit (wall-head)',
  'ceiling-cassette': 'Mount indoor unit (ceiling-cassette)',
  'floor-console': 'Mount indoor unit (floor-console)',
  'slim-ducted': 'Mount indoor unit (slim ducted)',
  'ducted-air-handler': 'Mount indoor unit (ducted-air-handler)',
};

/*
 * Derivation text: the parts that only depend on the defaults are built once here, so a
 * line's text is its own numbers plus these pieces and the circuit's "(system, zone)" suffix.
 */
const T = TAKEOFF_DEFAULTS;
const CABLE_SLACK_TEXT = ` ft + ${T.cableSlackFt} ft slack, rounded up to 5 ft`;
const LINE_COVER_PIECE_TEXT = ` ft ÷ ${T.lineCoverPieceFt} ft, rounded up`;
const LINE_COVER_DESCRIPTION = `Line cover ${T.lineCoverPieceFt} ft section`;

/**
 * The labor table a takeoff counts with, and where each entry came from: "default labor table", or the
 * price book's task by its description ("price-book task "Mount a wall unit"") — so every labor line says
 * whose hours it used (issue 13: the price book's labor tasks give each line its labor).
 */
class Labor {
  readonly h: LaborTable['hours'];
  private readonly from: LaborTable['from'];
  constructor(table: LaborTable) {
    this.h = table.hours;
    this.from = table.from;
  }
  /** "(default labor table)" or "(price-book task "A"; default labor table for …)". */
  by(...keys: LaborHoursKey[]): string {
    const named = keys.map((k) => this.from[k]).filter((x): x is string => x !== undefined);
    if (named.length === 0) return 'default labor table';
    const tasks = [...new Set(named)].map((n) => `"${n}"`).join(' and ');
    return `price-book task${named.length > 1 ? 's' : ''} ${tasks}${named.length < keys.length ? ' and the default labor table' : ''}`;
  }
}

/** Materials and labor lines for one circuit of a system (indoor unit, line set, accessories, labor), added to `out`. */
function circuitLines(
  name: string,
  c: Circuit,
  indoor: IndoorUnit,
  plan: CircuitCharge,
  heatPump: boolean,
  out: LineMerger,
  labor: Labor,
): void {
  const at = ` (${name}, zone ${c.zoneKey})`;
  const L = labor.h;
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
      `${c.lineCoverFt} ft × ${L.lineCoverPerFt} h/ft, ${labor.by('lineCoverPerFt')}${at}`,
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
  // Each kind of indoor unit is its own line, at its own task's hours and rate.
  const mount = MOUNT_LABOR[indoor.unitType];
  out.labor(
    `labor:mount-indoor:${indoor.unitType}`,
    MOUNT_DESCRIPTION[indoor.unitType],
    L[mount],
    `${L[mount]} h, ${labor.by(mount)}${at}`,
  );
  out.labor(
    'labor:run-line-set',
    'Run, flare/braze and support line set',
    L.lineSetBase + c.lengthFt * L.lineSetPerFt,
    `${L.lineSetBase} h + ${c.lengthFt} ft × ${L.lineSetPerFt} h/ft, ${labor.by('lineSetBase', 'lineSetPerFt')}${at}`,
  );
  if (c.wallPenetrations > 0)
    out.labor(
      'labor:wall-penetration',
      'Core wall penetration',
      c.wallPenetrations * L.wallPenetration,
      `${c.wallPenetrations} × ${L.wallPenetration} h, ${labor.by('wallPenetration')}${at}`,
    );
  const drain: LaborHoursKey = pump ? 'condensatePump' : 'condensateGravity';
  out.labor(
    pump ? 'labor:condensate-pump' : 'labor:condensate-gravity',
    pump ? 'Condensate pump and line' : 'Gravity condensate line',
    L[drain],
    `${L[drain]} h, ${labor.by(drain)}${at}`,
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
  runFt: number,
  name: string,
  out: LineMerger,
): void {
  const run = runFt;
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

/**
 * The disconnect of one branch circuit and what joins it to the equipment (calc's `disconnectRun`): a
 * pre-made whip within its reach, else liquid-tight flexible metal conduit by the foot with its conductors
 * (two hots and the ground, each the run + terminations + waste, rounded up to 5 ft), two connectors and
 * its supports.
 */
function disconnectLines(e: ElectricalPlan, name: string, equipment: string, out: LineMerger): void {
  out.mat(
    `disconnect:${e.disconnectA}a`,
    `AC disconnect, ${e.disconnectA} A non-fused`,
    1,
    'each',
    `within sight of ${equipment}; breaker ${e.breakerA ?? '?'} A (${name})`,
  );
  const run = e.disconnectRun;
  if (!run || e.breakerA === null || e.wireAwg === null) return;
  if (run.kind === 'whip') {
    out.mat(
      `whip:${run.size}x${run.lengthFt}ft`,
      `Liquid-tight whip ${run.size} in × ${run.lengthFt} ft`,
      1,
      'each',
      `disconnect to ${equipment}; ${run.text}; ${run.fillText} (${name})`,
    );
    return;
  }
  out.mat(
    `raceway:lfmc:${run.size}`,
    `Liquid-tight flexible metal conduit ${run.size} in`,
    run.lengthFt,
    'ft',
    `disconnect to ${equipment}; ${run.text}; ${run.fillText} (${name})`,
  );
  out.mat(
    `fitting:lfmc:${run.size}`,
    `Liquid-tight connector ${run.size} in`,
    2,
    'each',
    `one at each end of the liquid-tight run (${name})`,
  );
  out.mat(
    `strap:lfmc:${run.size}`,
    `Conduit strap ${run.size} in`,
    run.supports,
    'each',
    `supports of the ${run.lengthFt} ft liquid-tight run (${name})`,
  );
  const set = branchConductors({ awg: e.wireAwg, ocpdA: e.breakerA });
  const each = run.lengthFt + 2 * T.terminationAllowanceFtPerEnd;
  const waste = 1 + T.wireWastePercent / 100;
  const lengthText = `(${run.lengthFt} ft run + 2 × ${T.terminationAllowanceFtPerEnd} ft terminations) × ${waste} waste`;
  const ft = (count: number) => roundUpTo(roundHalfUp(count * each * waste, 2), T.cableStepFt);
  out.mat(
    `wire:thhn-conduit:${set.hot.awg}awg`,
    `${set.hot.awg} AWG copper THHN`,
    ft(set.hot.count),
    'ft',
    `liquid-tight run to ${equipment}: ${set.hot.count} conductors × ${lengthText}, rounded up to 5 ft (${name})`,
  );
  out.mat(
    `wire:thhn-conduit-ground:${set.ground.awg}awg`,
    `${set.ground.awg} AWG copper THHN, green (equipment ground)`,
    ft(set.ground.count),
    'ft',
    `liquid-tight run to ${equipment}: equipment ground (NEC Table 250.122), ${set.ground.count} conductor × ${lengthText}, rounded up to 5 ft (${name})`,
  );
}

/** A branch circuit's labor: base + its run by the foot, plus a field-made liquid-tight run by the foot. */
function electricalLabor(e: ElectricalPlan, circuitFt: number, name: string, out: LineMerger, labor: Labor): void {
  const L = labor.h;
  const run = e.disconnectRun?.kind === 'field-run' ? e.disconnectRun.lengthFt : 0;
  out.labor(
    'labor:electrical',
    'Branch circuit, disconnect and whip',
    L.electricalBase + (circuitFt + run) * L.electricalPerFt,
    `${L.electricalBase} h + ${run > 0 ? `(${circuitFt} ft circuit + ${run} ft liquid-tight run)` : `${circuitFt} ft`} × ${L.electricalPerFt} h/ft, ${labor.by('electricalBase', 'electricalPerFt')} (${name})`,
  );
}

/** Materials and labor lines for one system (equipment, line sets, accessories, electrical, refrigerant, labor), added to `out`. */
function systemLines(
  s: SystemForTakeoff,
  out: LineMerger,
  labor: Labor,
  refrigerantSoldBy: (r: OutdoorUnit['refrigerant']) => 'lb' | 'oz',
): void {
  const name = s.system.name;
  const L = labor.h;
  out.add(`equipment:${s.outdoor.key}`, s.outdoor.description, 1, 'each', 'equipment', `outdoor unit of ${name}`);
  const circuits = s.system.circuits;
  const heatPump = s.outdoor.equipmentType.startsWith('heat-pump');
  for (let i = 0; i < circuits.length; i += 1) {
    const c = circuits[i];
    const indoor = c && s.indoorByZone.get(c.zoneKey);
    const plan = s.refrigerant.circuits[i];
    if (c && indoor && plan) circuitLines(name, c, indoor, plan, heatPump, out, labor);
  }
  const bracket = s.system.mounting === 'wall-bracket';
  out.mat(
    bracket ? 'mount:wall-bracket' : 'mount:pad',
    bracket ? 'Outdoor unit wall bracket' : 'Outdoor unit pad',
    1,
    'each',
    `${name} mounting`,
  );
  const set: LaborHoursKey = bracket ? 'setOutdoorBracket' : 'setOutdoorPad';
  out.labor('labor:set-outdoor', 'Set outdoor unit', L[set], `${L[set]} h, ${labor.by(set)} (${name})`);
  const e = s.electrical;
  const wiring = s.system.electrical;
  disconnectLines(e, `${name}`, 'the outdoor unit', out);
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
      e.circuitLengthFt,
      name,
      out,
    );
  electricalLabor(e, e.circuitLengthFt, name, out, labor);
  if (s.heatKit) {
    out.add(`equipment:${s.heatKit.key}`, s.heatKit.description, 1, 'each', 'equipment', `backup heat for ${name}`);
    const k = s.heatKitElectrical;
    // The heat kit's own branch circuit: its disconnect at the air handler and the whip (or run) to it, and its labor.
    if (k) {
      disconnectLines(k, `${name}, heat kit`, 'the air handler', out);
      electricalLabor(k, k.circuitLengthFt, `${name}, heat kit`, out, labor);
    }
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
        k.circuitLengthFt,
        `${name}, heat kit`,
        out,
      );
  }
  // Refrigerant is priced by what is put in (issue 9), in the unit the price book sells it by (lb unless it says oz);
  // the cylinder it comes from is the company's stock item.
  const r = s.refrigerant;
  if (r.extraChargeOz > 0) {
    if (refrigerantSoldBy(r.refrigerant) === 'oz')
      out.mat(
        `refrigerant:${r.refrigerant}`,
        `${r.refrigerant} refrigerant added on site`,
        r.extraChargeOz,
        'oz',
        `${r.extraChargeOz} oz extra charge, priced by the ounce as the price book gives it (${name})`,
      );
    else {
      const lb = roundHalfUp(r.extraChargeOz / OZ_PER_LB, 2);
      out.mat(
        `refrigerant:${r.refrigerant}`,
        `${r.refrigerant} refrigerant added on site`,
        lb,
        'lb',
        `${r.extraChargeOz} oz extra charge ÷ 16 oz/lb = ${lb} lb (${name})`,
      );
    }
  }
  out.mat('nitrogen:test', 'Dry nitrogen for pressure test and purge', 1, 'each', `one test per system (${name})`);
  out.labor(
    'labor:pressure-test-evacuate',
    'Pressure test and evacuation',
    L.pressureTestEvacuate,
    `${L.pressureTestEvacuate} h, ${labor.by('pressureTestEvacuate')} (${name})`,
  );
  const count = circuits.length;
  out.labor(
    'labor:charge-startup',
    'Charge and start-up',
    L.chargeStartupBase + count * L.chargeStartupPerCircuit,
    `${L.chargeStartupBase} h + ${count} circuit(s) × ${L.chargeStartupPerCircuit} h, ${labor.by('chargeStartupBase', 'chargeStartupPerCircuit')} (${name})`,
  );
}

/**
 * The full takeoff for a design: every system's lines, merged by item key (quantities summed). Labor is
 * counted with `labor` (the price book's tasks where it has them; default: the default labor table).
 */
export function buildTakeoff({
  systems,
  labor = DEFAULT_LABOR_TABLE,
  refrigerantSoldBy = () => 'lb',
}: {
  readonly systems: readonly SystemForTakeoff[];
  readonly labor?: LaborTable | undefined;
  /** The unit the price book sells each refrigerant by: the extra charge's line is counted in it. */
  readonly refrigerantSoldBy?: (r: OutdoorUnit['refrigerant']) => 'lb' | 'oz';
}): TakeoffLine[] {
  const out = new LineMerger();
  const table = new Labor(labor);
  for (const s of systems) systemLines(s, out, table, refrigerantSoldBy);
  return out.lines();
}
