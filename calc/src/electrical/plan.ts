import { CAUTIONS } from '../refrigerant/cautions';
import type { ElectricalInput } from '../schemas/design';
import { breakerSizeA, copperAmpacityA, copperWireAwg, disconnectWithinSight } from './nec';
import { CalcError } from '../errors';

/** Electrical estimate for one outdoor unit's branch circuit. */
export interface ElectricalPlan {
  readonly mcaA: number;
  readonly mocpA: number;
  readonly breakerA: number | null;
  readonly wireAwg: number | null;
  readonly wireAmpacityA: number | null;
  readonly ampacityColumnC: 60 | 75;
  readonly disconnectWithinSight: boolean;
  readonly warnings: readonly string[];
  readonly caution: string;
  readonly isEstimate: true;
}

/**
 * Wire, breaker and disconnect from the nameplate MCA/MOCP. NM-B and UF-B cable use the
 * 60 °C column whatever the terminations [MEM: NEC 334.80, 340.80]; otherwise the
 * termination rating picks the column [MEM: NEC 110.14(C)]. Never throws for out-of-table
 * values: it returns nulls with a plain-word warning.
 */
export function electricalPlan({
  mcaA,
  mocpA,
  input,
}: {
  readonly mcaA: number;
  readonly mocpA: number;
  readonly input: ElectricalInput;
}): ElectricalPlan {
  const warnings: string[] = [];
  const column: 60 | 75 = input.wiringMethod === 'thhn-conduit' ? input.terminationC : 60;
  let wireAwg: number | null = null;
  let breakerA: number | null = null;
  try {
    wireAwg = copperWireAwg({ ampacityA: mcaA, terminationC: column });
  } catch (e) {
    if (!(e instanceof CalcError)) throw e;
    warnings.push(`An MCA of ${mcaA} A is beyond the wire sizes covered here; the electrician sizes the conductor.`);
  }
  try {
    breakerA = breakerSizeA({ mcaA, mocpA });
  } catch (e) {
    if (!(e instanceof CalcError)) throw e;
    warnings.push(
      `No standard breaker fits between the MCA (${mcaA} A) and the MOCP (${mocpA} A): check the nameplate.`,
    );
  }
  const withinSight = disconnectWithinSight({
    distanceFt: input.disconnectDistanceFt,
    visible: input.disconnectVisible,
  });
  if (!withinSight)
    warnings.push(
      'The disconnect must be within sight of the outdoor unit: visible from it and no more than 50 ft away (NEC 440.14).',
    );
  if (input.circuitLengthFt > 100)
    warnings.push(
      `The circuit runs ${input.circuitLengthFt} ft: the electrician should check voltage drop and may need a larger wire.`,
    );
  return {
    mcaA,
    mocpA,
    breakerA,
    wireAwg,
    wireAmpacityA: wireAwg === null ? null : copperAmpacityA({ awg: wireAwg, terminationC: column }),
    ampacityColumnC: column,
    disconnectWithinSight: withinSight,
    warnings,
    caution: CAUTIONS.electrical,
    isEstimate: true,
  };
}
