import { CalcError, num } from '../errors';
import { roundHalfUp } from '../rounding';

/**
 * The conductors of a branch circuit and the raceway that carries them, for the takeoff (issue 13).
 * A 208/230/240 V single-phase outdoor unit or heat kit takes two ungrounded conductors (L1, L2) and
 * an equipment grounding conductor; no neutral unless the maker's wiring diagram calls for one.
 * The maker's instructions, the local code and a licensed electrician decide; these are estimates.
 */

/** Copper equipment grounding conductor by the rating of the circuit's overcurrent device, A → AWG. [MEM: NEC Table 250.122] */
export const EGC_COPPER_AWG: readonly { readonly upToA: number; readonly awg: number }[] = [
  { upToA: 15, awg: 14 },
  { upToA: 20, awg: 12 },
  { upToA: 60, awg: 10 },
  { upToA: 100, awg: 8 },
  { upToA: 200, awg: 6 },
];

/** The smallest copper EGC for an overcurrent device of `ocpdA` (≤ 200 A). [MEM: NEC Table 250.122] */
export function egcCopperAwg({ ocpdA }: { readonly ocpdA: number }): number {
  const a = num(ocpdA, 'positive');
  const row = EGC_COPPER_AWG.find((r) => a <= r.upToA);
  if (!row) throw new CalcError('AMPACITY_ABOVE_TABLE');
  return row.awg;
}

/** Cross-section of one THHN/THWN-2 conductor, in². [MEM: NEC Chapter 9 Table 5] */
export const THHN_AREA_IN2: Readonly<Record<number, number>> = {
  14: 0.0097,
  12: 0.0133,
  10: 0.0211,
  8: 0.0366,
  6: 0.0507,
  4: 0.0824,
};

/** Total inside area (100 %) of EMT and of liquid-tight flexible metal conduit by trade size, in². [MEM: NEC Chapter 9 Table 4] */
export const RACEWAY_AREA_IN2 = {
  emt: { '1/2': 0.304, '3/4': 0.533, '1': 0.864, '1-1/4': 1.496 },
  lfmc: { '1/2': 0.314, '3/4': 0.541, '1': 0.873, '1-1/4': 1.277 },
} as const;

export type RacewayKind = keyof typeof RACEWAY_AREA_IN2;
export type TradeSize = keyof (typeof RACEWAY_AREA_IN2)['emt'];
/** Trade sizes smallest first (an object's own keys would put the integer-like "1" first). */
export const TRADE_SIZES: readonly TradeSize[] = ['1/2', '3/4', '1', '1-1/4'];

/** Largest share of a raceway's area conductors may fill: 1 conductor 53 %, 2 → 31 %, over 2 → 40 %. [MEM: NEC Chapter 9 Table 1] */
export function fillLimit(conductors: number): number {
  const n = num(conductors, 'positive');
  return n === 1 ? 0.53 : n === 2 ? 0.31 : 0.4;
}

export interface ConductorSet {
  /** Ungrounded (hot) conductors and their size. */
  readonly hot: { readonly count: number; readonly awg: number };
  /** The equipment grounding conductor. */
  readonly ground: { readonly count: number; readonly awg: number };
}

/** A 240 V-class circuit's conductors: two hots at `awg` and one EGC sized by Table 250.122 (never larger than the hots). */
export function branchConductors({ awg, ocpdA }: { readonly awg: number; readonly ocpdA: number }): ConductorSet {
  const egc = egcCopperAwg({ ocpdA });
  // A larger AWG number is a smaller wire: the EGC need not exceed the circuit conductors. [MEM: NEC 250.122(A)]
  return { hot: { count: 2, awg }, ground: { count: 1, awg: Math.max(egc, awg) } };
}

export interface RacewaySize {
  readonly size: TradeSize;
  readonly conductorAreaIn2: number;
  readonly allowedIn2: number;
  /** "3 conductors: 2 × 10 AWG + 1 × 10 AWG = 0.0633 in² ≤ 40 % of 1/2 in EMT (0.1216 in²)". */
  readonly text: string;
}

const KIND_LABEL: Record<RacewayKind, string> = { emt: 'EMT', lfmc: 'liquid-tight flexible metal conduit' };

/** The smallest trade size of `kind` whose fill limit holds the conductors (THHN areas). [MEM: NEC Chapter 9 Tables 1, 4, 5] */
export function racewaySize({ kind, set }: { readonly kind: RacewayKind; readonly set: ConductorSet }): RacewaySize {
  const area = (awg: number) => {
    const a = THHN_AREA_IN2[awg];
    if (a === undefined) throw new CalcError('AMPACITY_ABOVE_TABLE');
    return a;
  };
  const n = set.hot.count + set.ground.count;
  const total = roundHalfUp(set.hot.count * area(set.hot.awg) + set.ground.count * area(set.ground.awg), 4);
  const limit = fillLimit(n);
  for (const size of TRADE_SIZES) {
    const inside = RACEWAY_AREA_IN2[kind][size];
    const allowed = roundHalfUp(inside * limit, 4);
    if (total <= allowed)
      return {
        size,
        conductorAreaIn2: total,
        allowedIn2: allowed,
        text: `${n} conductors: ${set.hot.count} × ${set.hot.awg} AWG + ${set.ground.count} × ${set.ground.awg} AWG ground = ${total} in² ≤ ${limit * 100} % of ${size} in ${KIND_LABEL[kind]} (${allowed} in²)`,
      };
  }
  throw new CalcError('AMPACITY_ABOVE_TABLE');
}
