import { num } from '../errors';
import { roundHalfUp } from '../rounding';
import { extraChargeOz } from '../refrigerant/charge';
import { STANDARD_ATM_PSIA } from '../units';
import { nitrogenTestPsigAt } from './checks';

/*
 * The installer's commissioning record (issue 15): what the readings taken on site say.
 * Pure functions; the server stores the readings and shows these verdicts beside them.
 */

/** Gauge → absolute pressure, psia = psig + 14.696 (one standard atmosphere). [PUB: SI/NIST definitions; reference §1: 1 atm = 101,325 Pa = 14.696 psia] */
export function psigToPsia(psig: number): number {
  return num(psig) + STANDARD_ATM_PSIA;
}

/** Gauge readings must stay above a perfect vacuum: −14.696 psig is 0 psia. */
const gauge = (psig: number) => {
  num(psigToPsia(psig), 'nonNegative');
  return psig;
};

export type StandingTestOutcome =
  /** The end reading is what the start gives at the end temperature, within the gauge's resolution. */
  | 'held'
  /** The gauge dropped, but no more than the cooling explains. */
  | 'drop-explained-by-temperature'
  /** It dropped more than the temperature explains: nitrogen left the system. */
  | 'lost-pressure'
  /** It rose more than the warming explains: the readings do not fit together. */
  | 'check-readings';

export interface StandingTestReading {
  readonly outcome: StandingTestOutcome;
  readonly pass: boolean;
  /** What the end reading should be at the end temperature with nothing lost, psig (unrounded). */
  readonly expectedEndPsig: number;
  /** Start − end as read, psi. */
  readonly dropPsi: number;
  /** Expected end − end read, psi: the part of the drop the temperature does not explain. */
  readonly unexplainedPsi: number;
  /** The working in words. */
  readonly text: string;
  readonly words: string;
}

const psi = (v: number) => `${roundHalfUp(v, 1)}`;

/**
 * A standing nitrogen test read at two temperatures. Nitrogen at constant volume follows the
 * ideal-gas law, so the absolute pressure goes with the absolute temperature:
 * P₂ = P₁ × T₂ / T₁ (psia, °R) [PUB: ideal-gas law PV = nRT at fixed V and n — Gay-Lussac's law,
 * e.g. OpenStax University Physics vol. 2 §2.1; reference check 9.3]. A difference smaller than one
 * division of the gauge cannot be read, so `resolutionPsi` (the gauge's smallest division) is the
 * tolerance. The UL-derived A2L instructions ask for no decrease over the hold with a gauge
 * reading to ≤ 5 % of the test pressure [PUB: reference §9].
 */
export function standingTestReading({
  startPsig,
  startF,
  endPsig,
  endF,
  resolutionPsi,
}: {
  readonly startPsig: number;
  readonly startF: number;
  readonly endPsig: number;
  readonly endF: number;
  readonly resolutionPsi: number;
}): StandingTestReading {
  gauge(startPsig);
  gauge(endPsig);
  num(resolutionPsi, 'positive');
  const expectedEndPsig = nitrogenTestPsigAt({ psig: startPsig, fromF: startF, toF: endF });
  const dropPsi = startPsig - endPsig;
  const unexplainedPsi = expectedEndPsig - endPsig;
  const text = `(${psi(startPsig)} + 14.696) psia × (${endF} + 459.67) °R ÷ (${startF} + 459.67) °R − 14.696 = ${psi(expectedEndPsig)} psig expected at ${endF} °F; read ${psi(endPsig)} psig`;
  let outcome: StandingTestOutcome;
  let words: string;
  if (unexplainedPsi > resolutionPsi) {
    outcome = 'lost-pressure';
    words = `It lost ${psi(unexplainedPsi)} psi more than the temperature change explains: find the leak, repair it and test again.`;
  } else if (-unexplainedPsi > resolutionPsi) {
    outcome = 'check-readings';
    words = `It reads ${psi(-unexplainedPsi)} psi higher than the temperature change explains: check the gauge and take both temperatures at the same place on the system.`;
  } else if (dropPsi > resolutionPsi) {
    outcome = 'drop-explained-by-temperature';
    words = `The gauge dropped ${psi(dropPsi)} psi, which the cooling from ${startF} °F to ${endF} °F explains: no pressure was lost.`;
  } else {
    outcome = 'held';
    words = 'It held: no drop beyond one division of the gauge.';
  }
  return {
    outcome,
    pass: outcome === 'held' || outcome === 'drop-explained-by-temperature',
    expectedEndPsig,
    dropPsi,
    unexplainedPsi,
    text,
    words,
  };
}

/**
 * The company's evacuation policy. Default: reach 500 microns or less, isolate the pump, and the
 * gauge must not rise above 1,500 microns within 10 minutes — the instruction the UL 60335-2-40
 * family asks makers to print in their manuals [PUB: reference §9]. Many contractors hold a
 * stricter 1,000 microns over 10–15 minutes [common practice: reference §9 TRADE]; the owner sets it.
 */
export interface EvacuationPolicy {
  readonly targetMicrons: number;
  readonly maxRiseToMicrons: number;
  readonly holdMinutes: number;
}

export const DEFAULT_EVACUATION_POLICY: EvacuationPolicy = {
  targetMicrons: 500,
  maxRiseToMicrons: 1500,
  holdMinutes: 10,
};

export const EVACUATION_POLICY_BASIS =
  'Default from the instructions UL 60335-2-40 asks makers to print: evacuate to 500 microns or less, isolate the pump, and the gauge must not rise above 1,500 microns within 10 minutes. The owner may set a stricter rise limit or a longer hold; the maker’s instructions govern.';

/** One reading taken during the isolation hold. */
export interface HoldReading {
  readonly minute: number;
  readonly microns: number;
}

export type EvacuationTrend = 'levelled' | 'kept-rising' | 'not-enough-readings';

/**
 * Rose and levelled, or kept rising? With readings at three or more times during the hold, the rate
 * of rise over the last interval is compared with the rate over the first: a quarter of it or less
 * reads as levelled, half of it or more as still rising, between as not yet clear. A rise that levels
 * off below atmospheric is moisture or outgassing (keep dehydrating); one that keeps climbing toward
 * atmospheric is a leak [PUB: transport-refrigeration service literature, "pressure rise test",
 * reference §9]. The quarter/half thresholds are our own reading of "levelled" [common practice].
 */
export function holdTrend(readings: readonly HoldReading[]): EvacuationTrend {
  const sorted = [...readings]
    .map((r) => ({ minute: num(r.minute, 'nonNegative'), microns: num(r.microns, 'nonNegative') }))
    .sort((a, b) => a.minute - b.minute);
  if (sorted.length < 3) return 'not-enough-readings';
  const first = sorted[0]!;
  const second = sorted[1]!;
  const beforeLast = sorted[sorted.length - 2]!;
  const last = sorted[sorted.length - 1]!;
  if (second.minute === first.minute || last.minute === beforeLast.minute) return 'not-enough-readings';
  const firstRate = (second.microns - first.microns) / (second.minute - first.minute);
  const lastRate = (last.microns - beforeLast.microns) / (last.minute - beforeLast.minute);
  if (firstRate <= 0) return lastRate > 0 ? 'kept-rising' : 'levelled';
  if (lastRate <= firstRate / 4) return 'levelled';
  if (lastRate >= firstRate / 2) return 'kept-rising';
  return 'not-enough-readings';
}

export type EvacuationOutcome = 'pass' | 'not-reached' | 'rose-too-far' | 'hold-too-short';

export interface EvacuationReading {
  readonly outcome: EvacuationOutcome;
  readonly pass: boolean;
  readonly reached: boolean;
  readonly held: boolean;
  readonly trend: EvacuationTrend;
  readonly words: string;
}

const microns = (v: number) => `${Math.round(v).toLocaleString('en-US')} microns`;

/**
 * The evacuation step against the company's policy: the lowest reading reached (≤ target), the
 * reading after the isolation hold (≤ the rise limit), the hold at least the policy's minutes; with
 * the plain-words reading of the rise where the hold readings allow it (`holdTrend`).
 */
export function evacuationReading({
  reachedMicrons,
  afterHoldMicrons,
  holdMinutes,
  holdReadings = [],
  policy = DEFAULT_EVACUATION_POLICY,
}: {
  readonly reachedMicrons: number;
  readonly afterHoldMicrons: number;
  readonly holdMinutes: number;
  readonly holdReadings?: readonly HoldReading[];
  readonly policy?: EvacuationPolicy;
}): EvacuationReading {
  num(reachedMicrons, 'nonNegative');
  num(afterHoldMicrons, 'nonNegative');
  num(holdMinutes, 'nonNegative');
  num(policy.targetMicrons, 'positive');
  num(policy.maxRiseToMicrons, 'positive');
  num(policy.holdMinutes, 'positive');
  const reached = reachedMicrons <= policy.targetMicrons;
  const held = afterHoldMicrons <= policy.maxRiseToMicrons;
  const longEnough = holdMinutes >= policy.holdMinutes;
  const trend = holdTrend(holdReadings);
  const why =
    trend === 'levelled'
      ? ` It rose and levelled at ${microns(afterHoldMicrons)}: moisture or outgassing — evacuate again.`
      : trend === 'kept-rising'
        ? ' It kept rising through the hold: a leak — find it before evacuating again.'
        : '';
  let outcome: EvacuationOutcome;
  let words: string;
  if (!reached) {
    outcome = 'not-reached';
    words = `The lowest reading, ${microns(reachedMicrons)}, did not reach the ${microns(policy.targetMicrons)} target: keep evacuating.`;
  } else if (!held) {
    outcome = 'rose-too-far';
    words = `After the hold it read ${microns(afterHoldMicrons)}, above the ${microns(policy.maxRiseToMicrons)} limit.${why || ' Take readings during the hold to tell moisture (levels off) from a leak (keeps rising).'}`;
  } else if (!longEnough) {
    outcome = 'hold-too-short';
    words = `The hold was ${holdMinutes} min; the policy asks for ${policy.holdMinutes} min with the pump isolated.`;
  } else {
    outcome = 'pass';
    words = `Reached ${microns(reachedMicrons)} and stayed at or below ${microns(policy.maxRiseToMicrons)} over a ${holdMinutes} min hold.${trend === 'kept-rising' ? ' It was still rising at the end: watch for a slow leak.' : ''}`;
  }
  return { outcome, pass: outcome === 'pass', reached, held, trend, words };
}

/** One circuit as installed: its measured length (null = as planned) and its charge adder. */
export interface MeasuredCircuit {
  readonly key: string;
  readonly plannedInstalledFt: number;
  readonly measuredFt: number | null;
  readonly ozPerFt: number;
}

export interface RecomputedCharge {
  readonly circuits: ReadonlyArray<{
    readonly key: string;
    readonly lengthFt: number;
    readonly plannedOz: number;
    readonly extraOz: number;
  }>;
  readonly plannedOz: number;
  readonly extraOz: number;
  /** Weighed in − recomputed extra, oz (null when nothing was weighed in yet). */
  readonly differenceOz: number | null;
  readonly words: string;
}

/**
 * The extra charge recomputed from the measured line lengths with calc's `extraChargeOz`
 * (max(0, L − L_pre) × adder, no removal [reference §8]), per circuit for a per-circuit pre-charge,
 * or once over the total with each circuit's share at its own adder for a system-total pre-charge
 * (the same allocation as `refrigerantPlan`). Rounded half-up to 0.1 oz per circuit like the plan;
 * the difference from what was weighed in beside it.
 */
export function recomputedExtraCharge({
  circuits,
  prechargedLengthFt,
  prechargeBasis,
  weighedInOz,
}: {
  readonly circuits: readonly MeasuredCircuit[];
  readonly prechargedLengthFt: number;
  readonly prechargeBasis: 'per-circuit' | 'system-total';
  readonly weighedInOz: number | null;
}): RecomputedCharge {
  num(prechargedLengthFt, 'nonNegative');
  const lengths = circuits.map((c) => ({
    planned: num(c.plannedInstalledFt, 'nonNegative'),
    actual: c.measuredFt === null ? num(c.plannedInstalledFt, 'nonNegative') : num(c.measuredFt, 'nonNegative'),
    ozPerFt: num(c.ozPerFt, 'nonNegative'),
  }));
  const share = (pick: 'planned' | 'actual') => {
    if (prechargeBasis === 'per-circuit')
      return lengths.map((l) =>
        roundHalfUp(extraChargeOz({ lengthFt: l[pick], prechargedLengthFt, ozPerFt: l.ozPerFt }), 1),
      );
    const total = lengths.reduce((s, l) => s + l[pick], 0);
    // The system's length beyond its pre-charge, at 1 oz/ft: extraChargeOz gives the feet.
    const beyond = extraChargeOz({ lengthFt: total, prechargedLengthFt, ozPerFt: 1 });
    return lengths.map((l) => (total > 0 ? roundHalfUp(beyond * (l[pick] / total) * l.ozPerFt, 1) : 0));
  };
  const planned = share('planned');
  const actual = share('actual');
  const out = circuits.map((c, i) => ({
    key: c.key,
    lengthFt: lengths[i]!.actual,
    plannedOz: planned[i]!,
    extraOz: actual[i]!,
  }));
  const plannedOz = roundHalfUp(
    planned.reduce((s, v) => s + v, 0),
    1,
  );
  const extraOz = roundHalfUp(
    actual.reduce((s, v) => s + v, 0),
    1,
  );
  const differenceOz = weighedInOz === null ? null : roundHalfUp(num(weighedInOz, 'nonNegative') - extraOz, 1);
  const words =
    differenceOz === null
      ? `Extra charge for the measured lengths: ${extraOz} oz (planned ${plannedOz} oz).`
      : differenceOz === 0
        ? `Weighed in ${weighedInOz} oz, the same as the ${extraOz} oz the measured lengths call for.`
        : `Weighed in ${weighedInOz} oz; the measured lengths call for ${extraOz} oz: ${Math.abs(differenceOz)} oz ${differenceOz > 0 ? 'more' : 'less'} than that. Check against the maker's charging instructions.`;
  return { circuits: out, plannedOz, extraOz, differenceOz, words };
}
