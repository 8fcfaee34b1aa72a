import { num } from '../errors';
import { roundUpTo } from '../rounding';
import { racewaySize, type ConductorSet, type TradeSize } from './raceway';

/**
 * From the disconnect to the equipment [common practice]: a pre-made liquid-tight whip of this length when
 * the disconnect is no farther than it reaches; beyond it, a field-made run of liquid-tight flexible metal
 * conduit (LFMC) with its own conductors, connectors and supports.
 */
export const WHIP_LENGTH_FT = 6;
/** A field-made LFMC run: the distance plus this much at each end for the bend into its fitting [common practice]. */
export const LFMC_END_ALLOWANCE_FT = 1;
/**
 * LFMC is secured within 1 ft of each termination and at intervals of no more than 4½ ft [NEC 350.30(A), as
 * quoted in EC&M's Code Q&A "NEC Requirements for Support of LFMC", 2021]. Only up to 3 ft (trade sizes ½–1¼)
 * may be left unsecured where the equipment needs the flexibility (Exception No. 2, same source).
 */
export const LFMC_SUPPORT_MAX_FT = 4.5;
export const LFMC_END_SUPPORT_FT = 1;

/** What joins the disconnect to the equipment, and how much of it. */
export interface DisconnectRun {
  /** 'whip': one pre-made whip; 'field-run': LFMC by the foot with conductors, two connectors and supports. */
  readonly kind: 'whip' | 'field-run';
  readonly size: TradeSize;
  /** The whip's length, or the field run's length (rounded up to 5 ft). */
  readonly lengthFt: number;
  readonly distanceFt: number;
  /** Supports (straps) of a field run; 0 for a whip. */
  readonly supports: number;
  /** The raceway's fill, in words. */
  readonly fillText: string;
  /** How the length and supports were found, in words. */
  readonly text: string;
}

/**
 * The raceway from the disconnect to the equipment for `set` conductors `distanceFt` away: a 6 ft whip when it
 * reaches (≤ 6 ft), else a field-made LFMC run of distance + 2 × 1 ft, rounded up to 5 ft, supported within
 * 1 ft of each end and every ≤ 4½ ft between (supports = ⌈(length − 2 × 1 ft) ÷ 4½ ft⌉ + 1).
 */
export function disconnectRun({
  distanceFt,
  set,
}: {
  readonly distanceFt: number;
  readonly set: ConductorSet;
}): DisconnectRun {
  const d = num(distanceFt, 'nonNegative');
  const fill = racewaySize({ kind: 'lfmc', set });
  if (d <= WHIP_LENGTH_FT)
    return {
      kind: 'whip',
      size: fill.size,
      lengthFt: WHIP_LENGTH_FT,
      distanceFt: d,
      supports: 0,
      fillText: fill.text,
      text: `disconnect ${d} ft from the unit: a ${WHIP_LENGTH_FT} ft whip reaches`,
    };
  const lengthFt = roundUpTo(d + 2 * LFMC_END_ALLOWANCE_FT, 5);
  const between = Math.max(0, lengthFt - 2 * LFMC_END_SUPPORT_FT);
  const supports = Math.ceil(between / LFMC_SUPPORT_MAX_FT - 1e-9) + 1;
  return {
    kind: 'field-run',
    size: fill.size,
    lengthFt,
    distanceFt: d,
    supports,
    fillText: fill.text,
    text: `disconnect ${d} ft from the unit, beyond a ${WHIP_LENGTH_FT} ft whip: ${d} ft + 2 × ${LFMC_END_ALLOWANCE_FT} ft = ${d + 2 * LFMC_END_ALLOWANCE_FT} ft of liquid-tight, rounded up to ${lengthFt} ft; supports within ${LFMC_END_SUPPORT_FT} ft of each end and every ≤ ${LFMC_SUPPORT_MAX_FT} ft: ⌈(${lengthFt} − 2) ÷ ${LFMC_SUPPORT_MAX_FT}⌉ + 1 = ${supports} (NEC 350.30(A))`,
  };
}
