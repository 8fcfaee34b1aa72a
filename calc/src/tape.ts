import { roundHalfUp } from './rounding';
import { ftFromM, mFromFt } from './units';

/**
 * Tape-measure entry for length fields. People write lengths as they read a tape
 * (feet-and-inches notation is common practice in the US trades): `12'6"`, `12' 6`,
 * `12 ft 6 in`, `12-6`, `150"`, `12.5`, `12ft`, `6 in`, `12' 6 1/2"`. A metric company
 * types metres or centimetres (`3.8`, `3.8 m`, `380 cm`, `3800 mm`).
 * The result is canonical feet, or a refusal with a message a person can act on.
 * Nothing ambiguous is guessed: `12,5` (decimal comma or thousands separator?) is refused.
 */
export type TapeSystem = 'imperial' | 'metric';
export type TapeResult =
  { readonly ok: true; readonly feet: number } | { readonly ok: false; readonly message: string };

/** The imperial formatter rounds to the nearest 1/16 in (the finest mark on a common tape). */
export const TAPE_SIXTEENTHS_PER_FT = 192;

// A trailing point is allowed: "8." is on the way to 8.5.
const NUM = String.raw`(?:\d+(?:\.\d*)?|\.\d+)`;
const FEET_UNIT = String.raw`(?:'|ft|feet|foot)`;
const INCH_UNIT = String.raw`(?:"|in|inch|inches)`;
// Inches: a number, optionally followed by a fraction ("6 1/2"), or a fraction alone ("1/2").
const INCHES = String.raw`(?:(${NUM})(?:\s+(\d+)\/(\d+))?|(\d+)\/(\d+))`;

const FEET_AND_INCHES = new RegExp(String.raw`^(\d+)\s*${FEET_UNIT}\s*-?\s*${INCHES}\s*${INCH_UNIT}?$`);
const DASH = new RegExp(String.raw`^(\d+)\s*-\s*${INCHES}\s*${INCH_UNIT}?$`);
const FEET_ONLY = new RegExp(String.raw`^(${NUM})\s*${FEET_UNIT}?$`);
const INCHES_ONLY = new RegExp(String.raw`^${INCHES}\s*${INCH_UNIT}$`);
const METRIC = new RegExp(String.raw`^(${NUM})\s*(m|metres?|meters?|cm|mm)?$`);
const COMMA = /^(\d+),(\d+)\s*([a-z'"]*)$/;

const HOW_IMPERIAL = `Write a length like 12' 6", 12 ft 6 in, 12-6 or 12.5`;
const HOW_METRIC = 'Write a length like 3.8, 3.8 m or 380 cm';

/** Phones type curly quotes and primes; two apostrophes are an inch mark. */
function normalise(text: string): string {
  return text
    .trim()
    .toLowerCase()
    .replace(/[‘’′`]/g, "'")
    .replace(/[“”″]/g, '"')
    .replace(/''/g, '"')
    .replace(/\s+/g, ' ');
}

/** Inches from the INCHES groups (starting at `g`), or a refusal message. */
function inchesFrom(m: RegExpExecArray, g: number): number | string {
  const whole = m[g];
  const num = whole !== undefined ? m[g + 1] : m[g + 3];
  const den = whole !== undefined ? m[g + 2] : m[g + 4];
  let inches = whole !== undefined ? Number(whole) : 0;
  if (num !== undefined && den !== undefined) {
    const n = Number(num);
    const d = Number(den);
    if (d === 0 || n >= d) return `Write the fraction of an inch like 1/2 or 3/8`;
    if (whole !== undefined && !/^\d+$/.test(whole)) return `Write inches like 6 1/2 or 6.5, not both`;
    inches += n / d;
  }
  return inches;
}

function commaQuestion(m: RegExpExecArray, system: TapeSystem): string {
  const unit = m[3] ?? '';
  let shown: string;
  if (system === 'metric') shown = unit === '' ? 'm' : unit;
  else if (/^("|in|inch|inches)$/.test(unit)) shown = 'in';
  else shown = 'ft';
  return `Did you mean ${m[1]}.${m[2]} ${shown}? Use a point for decimals.`;
}

/** Parses what was typed into a length field. Empty text is not a length: the caller decides. */
export function parseTape(text: string, system: TapeSystem = 'imperial'): TapeResult {
  const t = normalise(text);
  const comma = COMMA.exec(t);
  if (comma) return { ok: false, message: commaQuestion(comma, system) };

  if (system === 'metric') {
    const m = METRIC.exec(t);
    if (!m) return { ok: false, message: HOW_METRIC };
    const v = Number(m[1]);
    const unit = m[2] ?? 'm';
    const metres = unit === 'cm' ? v / 100 : unit === 'mm' ? v / 1000 : v;
    return { ok: true, feet: ftFromM({ m: metres }) };
  }

  const fi = FEET_AND_INCHES.exec(t) ?? DASH.exec(t);
  if (fi) {
    const inches = inchesFrom(fi, 2);
    if (typeof inches === 'string') return { ok: false, message: inches };
    if (inches >= 12) {
      return { ok: false, message: `Inches after feet must be under 12 (${fi[1]} ft ${inches} in?)` };
    }
    return { ok: true, feet: Number(fi[1]) + inches / 12 };
  }
  const f = FEET_ONLY.exec(t);
  if (f) return { ok: true, feet: Number(f[1]) };
  const i = INCHES_ONLY.exec(t);
  if (i) {
    const inches = inchesFrom(i, 1);
    if (typeof inches === 'string') return { ok: false, message: inches };
    return { ok: true, feet: inches / 12 };
  }
  return { ok: false, message: HOW_IMPERIAL };
}

const centimetres = (feet: number) => roundHalfUp(mFromFt({ ft: feet }) * 100, 0);

/** The same length in whole centimetres ("381 cm"), shown beside the metres for a metric company. */
export function formatTapeCm(feet: number): string {
  return Number.isFinite(feet) && feet >= 0 ? `${centimetres(feet)} cm` : '';
}

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

/**
 * What a length field understood, in the company's units: imperial to the nearest 1/16 in
 * ("12 ft 6 in", "12 ft 6 1/2 in", "6 in"), metric to the centimetre ("3.81 m"; see formatTapeCm).
 * Whatever it returns, parseTape reads back.
 */
export function formatTape(feet: number, system: TapeSystem = 'imperial'): string {
  if (!Number.isFinite(feet) || feet < 0) return '';
  if (system === 'metric') return `${roundHalfUp(centimetres(feet) / 100, 2)} m`;
  const total = Math.round(feet * TAPE_SIXTEENTHS_PER_FT);
  const ft = Math.floor(total / TAPE_SIXTEENTHS_PER_FT);
  const rest = total - ft * TAPE_SIXTEENTHS_PER_FT;
  const wholeIn = Math.floor(rest / 16);
  const sixteenths = rest - wholeIn * 16;
  let inches = '';
  if (sixteenths > 0) {
    const g = gcd(sixteenths, 16);
    const frac = `${sixteenths / g}/${16 / g}`;
    inches = wholeIn > 0 ? `${wholeIn} ${frac} in` : `${frac} in`;
  } else if (wholeIn > 0) inches = `${wholeIn} in`;
  if (ft === 0) return inches === '' ? '0 ft' : inches;
  return inches === '' ? `${ft} ft` : `${ft} ft ${inches}`;
}
