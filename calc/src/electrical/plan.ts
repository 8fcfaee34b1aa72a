import { CAUTIONS } from '../refrigerant/cautions';
import type { ElectricalInput } from '../schemas/design';
import { breakerSizeA, copperAmpacityA, copperWireAwg, disconnectWithinSight } from './nec';
import { disconnectRun, WHIP_LENGTH_FT, type DisconnectRun } from './disconnect-run';
import { branchConductors } from './raceway';
import { CalcError } from '../errors';
import { explanation, input as inputOf, type Explanation } from '../explain/explanation';
import { formatNumber, formatPercent, formatQuantity } from '../explain/format';
import { roundHalfUp } from '../rounding';
import { COPPER_OHMS_PER_KFT_75C, VOLTAGE_DROP_ADVISED_PERCENT, awgForVoltageDrop, voltageDropV } from './voltage-drop';

const COPPER_R = (awg: number): number => COPPER_OHMS_PER_KFT_75C[awg] ?? 0;

/** Electrical estimate for one outdoor unit's branch circuit. */
export interface ElectricalPlan {
  readonly mcaA: number;
  readonly mocpA: number;
  readonly breakerA: number | null;
  readonly wireAwg: number | null;
  readonly wireAmpacityA: number | null;
  readonly ampacityColumnC: 60 | 75;
  readonly disconnectWithinSight: boolean;
  /** Disconnect rating, A: 60 A up to a 60 A breaker, else 100 A [TRADE: the common non-fused sizes]. */
  readonly disconnectA: number;
  readonly supplyVoltage: number;
  /** The run from the panel to the equipment the drop, wire and labor are worked over, ft. */
  readonly circuitLengthFt: number;
  /** Why that run is assumed rather than entered (e.g. the heat kit's run taken as the outdoor unit's), else null. */
  readonly circuitLengthAssumed: string | null;
  /** Drop over the run at the MCA with the chosen conductor, V and % (2 decimals); null without a conductor. */
  readonly voltageDropV: number | null;
  readonly voltageDropPercent: number | null;
  /** The smaller-drop conductor advised when the chosen one drops more than 3 %, else null. */
  readonly voltageDropAwg: number | null;
  /** From the disconnect to the equipment: a whip, or a field-made liquid-tight run beyond its reach; null without a conductor and breaker. */
  readonly disconnectRun: DisconnectRun | null;
  readonly warnings: readonly string[];
  /** Conductor, breaker, disconnect and voltage drop, each with its why. */
  readonly explanations: readonly Explanation[];
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
  input: wiring,
  keyPrefix = '',
  label = 'outdoor unit',
  assumedRun,
}: {
  readonly mcaA: number;
  readonly mocpA: number;
  readonly input: ElectricalInput;
  /** Prefix of the explanations' keys (e.g. "sys-1:"), so two circuits in one design stay apart. */
  readonly keyPrefix?: string;
  /** What the circuit feeds, for the words ("outdoor unit", "heat kit"). */
  readonly label?: string;
  /** The run was not entered: what is assumed, in plain words (shown as a warning and in the drop's why). */
  readonly assumedRun?: string;
}): ElectricalPlan {
  const input = wiring;
  const warnings: string[] = assumedRun === undefined ? [] : [assumedRun];
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
  const volts = input.supplyVoltage ?? 240;
  const amp = wireAwg === null ? null : copperAmpacityA({ awg: wireAwg, terminationC: column });
  const dropV =
    wireAwg === null ? null : voltageDropV({ awg: wireAwg, lengthFt: input.circuitLengthFt, currentA: mcaA });
  const dropPct = dropV === null ? null : (dropV / volts) * 100;
  const advised =
    wireAwg !== null && dropPct !== null && dropPct > VOLTAGE_DROP_ADVISED_PERCENT + 1e-9
      ? awgForVoltageDrop({ fromAwg: wireAwg, lengthFt: input.circuitLengthFt, currentA: mcaA, volts })
      : null;
  if (dropPct !== null && dropPct > VOLTAGE_DROP_ADVISED_PERCENT + 1e-9)
    warnings.push(
      `The ${input.circuitLengthFt} ft run drops ${formatPercent(dropPct, 1)} of ${volts} V at the MCA on ${wireAwg} AWG: ${advised === null ? 'the electrician sizes a larger conductor' : `${advised} AWG keeps it within ${VOLTAGE_DROP_ADVISED_PERCENT} %`}.`,
    );
  const disconnectA = (breakerA ?? mocpA) <= 60 ? 60 : 100;
  const run =
    wireAwg === null || breakerA === null
      ? null
      : disconnectRun({
          distanceFt: input.disconnectDistanceFt,
          set: branchConductors({ awg: wireAwg, ocpdA: breakerA }),
        });
  if (run?.kind === 'field-run')
    warnings.push(
      `The disconnect is ${formatQuantity(run.distanceFt, 'ft', 1)} from the ${label}: a ${WHIP_LENGTH_FT} ft whip does not reach, so the takeoff counts ${run.lengthFt} ft of ${run.size} in liquid-tight flexible metal conduit with its conductors, two connectors and ${run.supports} supports (secured within 1 ft of each end and at least every 4½ ft, NEC 350.30(A)). A disconnect beside the unit is the usual practice; it must stay within sight of the unit (visible and no more than 50 ft away, NEC 440.14 and Art. 100). A licensed electrician confirms.`,
    );
  const A = (v: number) => formatQuantity(v, 'A', 1);
  const method =
    input.wiringMethod === 'thhn-conduit'
      ? `THHN in conduit, ${input.terminationC} °C terminations`
      : `${input.wiringMethod === 'nm-b' ? 'NM-B' : 'UF-B'} cable (60 °C column)`;
  const explanations: Explanation[] = [
    explanation({
      key: `${keyPrefix}elec:conductor`,
      label: `Conductor, ${label}`,
      value: wireAwg ?? 0,
      unit: 'AWG',
      valueText: wireAwg === null ? 'sized by the electrician' : `${wireAwg} AWG copper`,
      text:
        wireAwg === null || amp === null
          ? `MCA ${A(mcaA)} is beyond the table rows covered here`
          : `MCA ${A(mcaA)} → smallest copper with ampacity ≥ MCA in the ${column} °C column: ${wireAwg} AWG (${A(amp)}), ${method}`,
      inputs: [inputOf('MCA', mcaA, 'A', A(mcaA))],
      status: wireAwg === null ? 'warning' : 'ok',
      verdict: 'An estimate: a licensed electrician confirms it.',
      source: 'NEC 440.4(B)/440.35 (nameplate MCA), Table 310.16, 110.14(C), 334.80',
    }),
    explanation({
      key: `${keyPrefix}elec:breaker`,
      label: `Breaker, ${label}`,
      value: breakerA ?? 0,
      unit: 'A',
      valueText: breakerA === null ? 'none fits' : `${breakerA} A two-pole`,
      text:
        breakerA === null
          ? `No standard rating lies between MCA ${A(mcaA)} and MOCP ${A(mocpA)}`
          : `Largest standard rating ≤ MOCP ${A(mocpA)} and ≥ MCA ${A(mcaA)}: ${breakerA} A`,
      inputs: [inputOf('MCA', mcaA, 'A', A(mcaA)), inputOf('MOCP', mocpA, 'A', A(mocpA))],
      status: breakerA === null ? 'blocker' : 'ok',
      source: 'NEC 440.22 / nameplate MOCP; standard ratings NEC 240.6(A)',
    }),
    explanation({
      key: `${keyPrefix}elec:disconnect`,
      label: `Disconnect, ${label}`,
      value: disconnectA,
      unit: 'A',
      valueText: `${disconnectA} A non-fused`,
      text: `${disconnectA} A non-fused for a ${breakerA ?? mocpA} A circuit, ${formatQuantity(input.disconnectDistanceFt, 'ft', 1)} from the unit${input.disconnectVisible ? ', in sight' : ', not in sight'}`,
      status: withinSight ? 'ok' : 'blocker',
      verdict: withinSight
        ? 'Within sight (visible and ≤ 50 ft).'
        : 'Not within sight: it must be visible from the unit and ≤ 50 ft away.',
      source:
        'NEC 440.14 (within sight from and readily accessible from the equipment); "within sight" = visible and ≤ 50 ft, NEC Art. 100 (as quoted in EC&M Code Q&A)',
    }),
  ];
  if (run)
    explanations.push(
      explanation({
        key: `${keyPrefix}elec:disconnect-run`,
        label: `From the disconnect to the ${label}`,
        value: run.lengthFt,
        unit: 'ft',
        valueText:
          run.kind === 'whip'
            ? `${WHIP_LENGTH_FT} ft whip, ${run.size} in`
            : `${run.lengthFt} ft liquid-tight run, ${run.size} in`,
        text: `${run.text}; ${run.fillText}`,
        inputs: [inputOf('Disconnect from the unit', run.distanceFt, 'ft', formatQuantity(run.distanceFt, 'ft', 1))],
        status: run.kind === 'whip' ? 'ok' : 'warning',
        verdict:
          run.kind === 'whip'
            ? 'A pre-made whip reaches.'
            : 'Beyond a whip: a field-made liquid-tight run, secured along its length. A disconnect beside the unit is the usual practice.',
        source:
          'NEC 350.30(A) (LFMC secured within 1 ft of each end and every 4½ ft), as quoted in EC&M Code Q&A 2021; 6 ft whip and 1 ft end allowances common practice; NEC Ch. 9 Table 1 fill',
      }),
    );
  if (dropV !== null && dropPct !== null && wireAwg !== null)
    explanations.push(
      explanation({
        key: `${keyPrefix}elec:voltage-drop`,
        label: `Voltage drop, ${label}`,
        value: roundHalfUp(dropPct, 2),
        unit: '%',
        valueText: formatPercent(dropPct, 1),
        text: `2 × ${formatQuantity(input.circuitLengthFt, 'ft', 1)} × ${A(mcaA)} × ${formatNumber(COPPER_R(wireAwg), 3, { trim: true })} Ω/1000 ft = ${formatQuantity(dropV, 'V', 2)} = ${formatPercent(dropPct, 1)} of ${volts} V${assumedRun === undefined ? '' : `. ${assumedRun}`}`,
        inputs: [
          inputOf(
            assumedRun === undefined ? 'Run' : 'Run (assumed)',
            input.circuitLengthFt,
            'ft',
            formatQuantity(input.circuitLengthFt, 'ft', 1),
          ),
          inputOf('Current (MCA)', mcaA, 'A', A(mcaA)),
          inputOf('Supply', volts, 'V', `${volts} V`),
        ],
        verdict:
          dropPct <= VOLTAGE_DROP_ADVISED_PERCENT + 1e-9
            ? `Within the advised ${VOLTAGE_DROP_ADVISED_PERCENT} %.`
            : `Above the advised ${VOLTAGE_DROP_ADVISED_PERCENT} %${advised === null ? '' : `: ${advised} AWG keeps it within`}.`,
        status: dropPct <= VOLTAGE_DROP_ADVISED_PERCENT + 1e-9 ? 'ok' : 'warning',
        source:
          'Ohm’s law over the loop; copper resistance at 75 °C, NEC Ch. 9 Table 8; 3 % advice, NEC 210.19(A) note',
      }),
    );
  return {
    mcaA,
    mocpA,
    breakerA,
    wireAwg,
    wireAmpacityA: amp,
    ampacityColumnC: column,
    disconnectWithinSight: withinSight,
    disconnectA,
    supplyVoltage: volts,
    circuitLengthFt: input.circuitLengthFt,
    circuitLengthAssumed: assumedRun ?? null,
    voltageDropV: dropV === null ? null : roundHalfUp(dropV, 2),
    voltageDropPercent: dropPct === null ? null : roundHalfUp(dropPct, 2),
    voltageDropAwg: advised,
    disconnectRun: run,
    warnings,
    explanations,
    caution: CAUTIONS.electrical,
    isEstimate: true,
  };
}
