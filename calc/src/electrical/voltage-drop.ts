import { CalcError, num } from '../errors';

/**
 * DC resistance of uncoated stranded copper at 75 °C, Ω per 1000 ft, by AWG.
 * [MEM: NEC Chapter 9 Table 8; checked in tests against the AWG diameter definition (ASTM B258) and
 * the IACS resistivity of annealed copper corrected to 75 °C, within the stranding allowance]
 */
export const COPPER_OHMS_PER_KFT_75C: Readonly<Record<number, number>> = {
  14: 3.14,
  12: 1.98,
  10: 1.24,
  8: 0.778,
  6: 0.491,
  4: 0.308,
};

/** Recommended largest voltage drop on a branch circuit, %. [MEM: NEC 210.19(A) Informational Note 4 — advice, not a rule] */
export const VOLTAGE_DROP_ADVISED_PERCENT = 3;

/**
 * Voltage drop of a single-phase two-wire run, V = 2 × L × I × R / 1000 (out and back), with R the
 * conductor's resistance per 1000 ft at 75 °C and I the current (the nameplate MCA here: an upper
 * bound of the running current). [PUB: Ohm's law over the loop length; R from NEC Ch. 9 Table 8 (MEM)]
 * No rounding.
 */
export function voltageDropV({
  awg,
  lengthFt,
  currentA,
}: {
  readonly awg: number;
  readonly lengthFt: number;
  readonly currentA: number;
}): number {
  const r = COPPER_OHMS_PER_KFT_75C[awg];
  if (r === undefined) throw new CalcError('AMPACITY_ABOVE_TABLE');
  return (2 * num(lengthFt, 'nonNegative') * num(currentA, 'nonNegative') * r) / 1000;
}

/** The smallest copper size (from `fromAwg` up to 4 AWG) whose drop stays within `percent` of `volts`; null if none. */
export function awgForVoltageDrop({
  fromAwg,
  lengthFt,
  currentA,
  volts,
  percent = VOLTAGE_DROP_ADVISED_PERCENT,
}: {
  readonly fromAwg: number;
  readonly lengthFt: number;
  readonly currentA: number;
  readonly volts: number;
  readonly percent?: number;
}): number | null {
  for (const awg of [14, 12, 10, 8, 6, 4]) {
    if (awg > fromAwg) continue;
    if ((voltageDropV({ awg, lengthFt, currentA }) / num(volts, 'positive')) * 100 <= percent + 1e-9) return awg;
  }
  return null;
}
