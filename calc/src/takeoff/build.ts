import type { ElectricalPlan } from '../electrical/plan';
import type { RefrigerantPlan } from '../refrigerant/circuits';
import { roundHalfUp, roundUpTo } from '../rounding';
import type { System } from '../schemas/design';
import type { IndoorUnit, OutdoorUnit } from '../schemas/equipment';
import { OZ_PER_LB } from '../units';
import { LABOR_HOURS, TAKEOFF_DEFAULTS } from './defaults';
import { mergeLines, type TakeoffLine } from './lines';

/** What the takeoff needs to know about one system. */
export interface SystemForTakeoff {
  readonly system: System;
  readonly outdoor: OutdoorUnit;
  readonly indoorByZone: ReadonlyMap<string, IndoorUnit>;
  readonly refrigerant: RefrigerantPlan;
  readonly electrical: ElectricalPlan;
}

const mat = (itemKey: string, description: string, quantity: number, unit: TakeoffLine['unit'], derivation: string): TakeoffLine =>
  ({ itemKey, description, quantity, unit, category: 'material', derivation });
const labor = (itemKey: string, description: string, hours: number, derivation: string): TakeoffLine =>
  ({ itemKey, description, quantity: roundHalfUp(hours, 2), unit: 'h', category: 'labor', derivation });

/** Shortest stock kit ≥ length, or null when the run is longer than every kit. */
export function stockKitLengthFt({ lengthFt }: { readonly lengthFt: number }): number | null {
  return TAKEOFF_DEFAULTS.lineSetKitLengthsFt.find((k) => k >= lengthFt) ?? null;
}

/** Whole cylinders to buy for an extra charge, oz → ceil(lb / cylinder lb). 0 when nothing is added. */
export function cylindersToBuy({ extraOz, cylinderLb }: { readonly extraOz: number; readonly cylinderLb: number }): number {
  return extraOz <= 0 ? 0 : Math.ceil(extraOz / OZ_PER_LB / cylinderLb - 1e-9);
}

const MOUNT_LABOR: Record<IndoorUnit['unitType'], number> = {
  'wall-head': LABOR_HOURS.mountWallHead, 'ceiling-cassette': LABOR_HOURS.mountCassette,
  'floor-console': LABOR_HOURS.mountFloorConsole, 'ducted-air-handler': LABOR_HOURS.mountAirHandler,
};

/** Materials and labor lines for one system (equipment, line sets, accessories, electrical, refrigerant, labor). */
function systemLines(s: SystemForTakeoff): TakeoffLine[] {
  const out: TakeoffLine[] = [];
  const name = s.system.name;
  out.push({ itemKey: `equipment:${s.outdoor.key}`, description: s.outdoor.description, quantity: 1, unit: 'each', category: 'equipment', derivation: `outdoor unit of ${name}` });
  for (const [i, c] of s.system.circuits.entries()) {
    const indoor = s.indoorByZone.get(c.zoneKey);
    const plan = s.refrigerant.circuits[i];
    if (!indoor || !plan) continue;
    const where = `${name}, zone ${c.zoneKey}`;
    out.push({ itemKey: `equipment:${indoor.key}`, description: indoor.description, quantity: 1, unit: 'each', category: 'equipment', derivation: `indoor unit for ${where}` });
    const sizes = `${plan.liquidLabel}x${plan.suctionLabel}`;
    const kit = stockKitLengthFt({ lengthFt: c.lengthFt });
    if (kit !== null) {
      out.push(mat(`line-set-kit:${sizes}:${kit}ft`, `Insulated line-set kit ${plan.liquidLabel} × ${plan.suctionLabel} in, ${kit} ft`, 1, 'each', `${c.lengthFt} ft run rounded up to the ${kit} ft stock kit (${where})`));
    } else {
      const ft = roundUpTo(c.lengthFt, 5);
      out.push(mat(`copper-acr:${plan.liquidLabel}`, `ACR copper ${plan.liquidLabel} in, coil`, ft, 'ft', `${c.lengthFt} ft run longer than any kit, rounded up to 5 ft (${where})`));
      out.push(mat(`copper-acr:${plan.suctionLabel}`, `ACR copper ${plan.suctionLabel} in, coil`, ft, 'ft', `same run, suction line (${where})`));
      out.push(mat(`pipe-insulation:${plan.suctionLabel}`, `Pipe insulation for ${plan.suctionLabel} in`, ft, 'ft', `suction line insulation (${where})`));
    }
    out.push(mat('insulation-tape', 'Insulation tape for joints', 1, 'roll', `one roll per circuit (${where})`));
    out.push(mat('comm-cable:14-4', 'Communication cable 14/4 stranded', roundUpTo(c.lengthFt + TAKEOFF_DEFAULTS.cableSlackFt, TAKEOFF_DEFAULTS.cableStepFt), 'ft', `${c.lengthFt} ft + ${TAKEOFF_DEFAULTS.cableSlackFt} ft slack, rounded up to 5 ft (${where})`));
    if (c.wallPenetrations > 0) out.push(mat('wall-sleeve', 'Wall sleeve with cap', c.wallPenetrations, 'each', `${c.wallPenetrations} wall penetration(s) (${where})`));
    if (c.lineCoverFt > 0) {
      const pieces = Math.ceil(c.lineCoverFt / TAKEOFF_DEFAULTS.lineCoverPieceFt - 1e-9);
      out.push(mat('line-cover:straight', `Line cover ${TAKEOFF_DEFAULTS.lineCoverPieceFt} ft section`, pieces, 'each', `${c.lineCoverFt} ft ÷ ${TAKEOFF_DEFAULTS.lineCoverPieceFt} ft, rounded up (${where})`));
      out.push(mat('line-cover:wall-inlet', 'Line cover wall inlet', 1, 'each', `one per covered run (${where})`));
      out.push(labor('labor:line-cover', 'Install line cover', c.lineCoverFt * LABOR_HOURS.lineCoverPerFt, `${c.lineCoverFt} ft × ${LABOR_HOURS.lineCoverPerFt} h/ft (${where})`));
    }
    const pump = c.condensate === 'pump' || indoor.needsCondensatePump;
    if (pump) out.push(mat('condensate-pump', 'Condensate pump', 1, 'each', `pump drain (${where})`));
    if (c.condensateLengthFt > 0) {
      out.push(mat('condensate-line:3/4', 'Condensate line 3/4 in', roundUpTo(c.condensateLengthFt, TAKEOFF_DEFAULTS.condensateStepFt), 'ft', `${c.condensateLengthFt} ft rounded up to 10 ft (${where})`));
    }
    out.push(mat('fasteners:kit', 'Fastener and strap kit', 1, 'each', `one per circuit (${where})`));
    out.push(labor('labor:mount-indoor', `Mount indoor unit (${indoor.unitType})`, MOUNT_LABOR[indoor.unitType], `labor table (${where})`));
    out.push(labor('labor:run-line-set', 'Run, flare/braze and support line set', LABOR_HOURS.lineSetBase + c.lengthFt * LABOR_HOURS.lineSetPerFt, `${LABOR_HOURS.lineSetBase} h + ${c.lengthFt} ft × ${LABOR_HOURS.lineSetPerFt} h/ft (${where})`));
    if (c.wallPenetrations > 0) out.push(labor('labor:wall-penetration', 'Core wall penetration', c.wallPenetrations * LABOR_HOURS.wallPenetration, `${c.wallPenetrations} × ${LABOR_HOURS.wallPenetration} h (${where})`));
    out.push(labor(pump ? 'labor:condensate-pump' : 'labor:condensate-gravity', pump ? 'Condensate pump and line' : 'Gravity condensate line', pump ? LABOR_HOURS.condensatePump : LABOR_HOURS.condensateGravity, `labor table (${where})`));
  }
  const bracket = s.system.mounting === 'wall-bracket';
  out.push(mat(bracket ? 'mount:wall-bracket' : 'mount:pad', bracket ? 'Outdoor unit wall bracket' : 'Outdoor unit pad', 1, 'each', `${name} mounting`));
  out.push(labor('labor:set-outdoor', 'Set outdoor unit', bracket ? LABOR_HOURS.setOutdoorBracket : LABOR_HOURS.setOutdoorPad, `labor table (${name})`));
  const e = s.electrical;
  const disconnectA = (e.breakerA ?? e.mocpA) <= 60 ? 60 : 100;
  out.push(mat(`disconnect:${disconnectA}a`, `AC disconnect, ${disconnectA} A non-fused`, 1, 'each', `within sight of ${name}; breaker ${e.breakerA ?? '?'} A`));
  out.push(mat('whip:3/4x6ft', 'Liquid-tight whip 3/4 in × 6 ft', 1, 'each', `disconnect to unit (${name})`));
  if (e.breakerA !== null) out.push(mat(`breaker:2p-${e.breakerA}a`, `2-pole breaker ${e.breakerA} A`, 1, 'each', `largest standard rating ≤ MOCP ${e.mocpA} A and ≥ MCA ${e.mcaA} A (${name})`));
  if (e.wireAwg !== null) {
    const ft = roundUpTo(s.system.electrical.circuitLengthFt + TAKEOFF_DEFAULTS.cableSlackFt, TAKEOFF_DEFAULTS.cableStepFt);
    out.push(mat(`wire:${s.system.electrical.wiringMethod}:${e.wireAwg}awg`, `${e.wireAwg} AWG copper, ${s.system.electrical.wiringMethod}`, ft, 'ft', `MCA ${e.mcaA} A → ${e.wireAwg} AWG at ${e.ampacityColumnC} °C; ${s.system.electrical.circuitLengthFt} ft + slack, rounded up to 5 ft (${name})`));
  }
  out.push(labor('labor:electrical', 'Branch circuit, disconnect and whip', LABOR_HOURS.electricalBase + s.system.electrical.circuitLengthFt * LABOR_HOURS.electricalPerFt, `${LABOR_HOURS.electricalBase} h + ${s.system.electrical.circuitLengthFt} ft × ${LABOR_HOURS.electricalPerFt} h/ft (${name})`));
  const r = s.refrigerant;
  const cylLb = TAKEOFF_DEFAULTS.cylinderLb[r.refrigerant];
  const cylinders = cylindersToBuy({ extraOz: r.extraChargeOz, cylinderLb: cylLb });
  if (cylinders > 0) out.push(mat(`refrigerant:${r.refrigerant}:${cylLb}lb`, `${r.refrigerant} refrigerant, ${cylLb} lb cylinder`, cylinders, 'cylinder', `${r.extraChargeOz} oz extra charge = ${roundHalfUp(r.extraChargeOz / OZ_PER_LB, 2)} lb → ${cylinders} × ${cylLb} lb (${name})`));
  out.push(mat('nitrogen:test', 'Dry nitrogen for pressure test and purge', 1, 'each', `one test per system (${name})`));
  out.push(labor('labor:pressure-test-evacuate', 'Pressure test and evacuation', LABOR_HOURS.pressureTestEvacuate, `labor table (${name})`));
  const circuits = s.system.circuits.length;
  out.push(labor('labor:charge-startup', 'Charge and start-up', LABOR_HOURS.chargeStartupBase + circuits * LABOR_HOURS.chargeStartupPerCircuit, `${LABOR_HOURS.chargeStartupBase} h + ${circuits} circuit(s) × ${LABOR_HOURS.chargeStartupPerCircuit} h (${name})`));
  return out;
}

/** The full takeoff for a design: every system's lines, merged by item key (quantities summed). */
export function buildTakeoff({ systems }: { readonly systems: readonly SystemForTakeoff[] }): TakeoffLine[] {
  const all: TakeoffLine[] = [];
  for (const s of systems) for (const line of systemLines(s)) all.push(line);
  return mergeLines(all);
}
