/**
 * "Every number has its why": the structured explanation calc gives with each computed number
 * the estimator's desk shows. The screen, the proposal PDF and the installer's packet print
 * `text` (and `verdict`) as they are, so all three say the same thing; `inputs` let a screen
 * show the figures as a small table. Everything is built with the deterministic formatters of
 * `format.ts`, so the same inputs always give the same characters.
 */

/** One input of a calculation, already formatted with its unit. */
export interface ExplainedInput {
  readonly label: string;
  readonly value: number;
  readonly unit: string;
  /** The value as printed in `text`, e.g. "25 ft". */
  readonly text: string;
}

/** How a number stands against its limit: fine, worth a look, or stopping "ready to propose". */
export type ExplanationStatus = 'ok' | 'note' | 'warning' | 'blocker';

export interface Explanation {
  /** Stable id within one design result, e.g. "charge:sys-1:zone-2" (screens key on it). */
  readonly key: string;
  /** What the number is, in plain words: "Extra charge, Living room circuit". */
  readonly label: string;
  /** The result, in `unit` (cents for money, unrounded only where `text` says so). */
  readonly value: number;
  readonly unit: string;
  /** The result as printed: "6.4 oz". */
  readonly valueText: string;
  /** The worked formula with the inputs and the result: "65 ft installed − 25 ft pre-charged = 40 ft × 0.16 oz/ft = 6.4 oz". */
  readonly text: string;
  readonly inputs: readonly ExplainedInput[];
  /** The verdict in plain words, where the number is checked against a limit. */
  readonly verdict?: string;
  readonly status: ExplanationStatus;
  /** Where the method or the limit comes from: a standard, the maker's data, company policy. */
  readonly source?: string;
}

/** An input for `explanation()` (`text` is made by the caller with the formatters). */
export function input(label: string, value: number, unit: string, text: string): ExplainedInput {
  return { label, value, unit, text };
}

/** Builds an Explanation, leaving out absent optional fields (so results stay plain JSON). */
export function explanation(e: {
  readonly key: string;
  readonly label: string;
  readonly value: number;
  readonly unit: string;
  readonly valueText: string;
  readonly text: string;
  readonly inputs?: readonly ExplainedInput[];
  readonly verdict?: string | undefined;
  readonly status?: ExplanationStatus;
  readonly source?: string | undefined;
}): Explanation {
  const out: {
    -readonly [K in keyof Explanation]: Explanation[K];
  } = {
    key: e.key,
    label: e.label,
    value: e.value,
    unit: e.unit,
    valueText: e.valueText,
    text: e.text,
    inputs: e.inputs ?? [],
    status: e.status ?? 'ok',
  };
  if (e.verdict !== undefined) out.verdict = e.verdict;
  if (e.source !== undefined) out.source = e.source;
  return out;
}
