/**
 * The calc error vocabulary: one class, one assert helper, constant messages.
 * The server maps a CalcError to a 400/422 problem+json using `code` and `message`.
 */

/** Every human-readable message calc can throw, keyed by a stable code. Tested by value. */
export const CALC_ERROR_MESSAGES = {
  NOT_A_NUMBER: 'Enter a number.',
  NOT_FINITE: 'The value must be a finite number.',
  NEGATIVE: 'The value must not be negative.',
  NOT_POSITIVE: 'The value must be greater than zero.',
  NOT_INTEGER: 'The value must be a whole number.',
  FRACTION_OUT_OF_RANGE: 'The fraction must be between 0 and 1.',
  PERCENT_OUT_OF_RANGE: 'The percentage is outside the allowed range.',
  EMPTY_LIST: 'At least one value is needed.',
  UNKNOWN_TUBE_OD: 'Unknown tube size: use an ASTM B280 ACR size of 1/4, 5/16, 3/8, 1/2, 5/8, 3/4 or 7/8 in.',
  AMPACITY_ABOVE_TABLE:
    'The required ampacity is above the 4 AWG copper row of NEC Table 310.16 covered here; size the conductor by hand.',
  UNKNOWN_TERMINATION: 'Termination rating must be 60 or 75 °C.',
  NO_STANDARD_BREAKER:
    'No standard breaker rating fits between the circuit ampacity (MCA) and the maximum overcurrent protection (MOCP).',
  MARGIN_TOO_HIGH: 'Margin must be below 100 %.',
  ABSOLUTE_ZERO: 'The temperature is below absolute zero.',
  WET_BULB_ABOVE_DRY_BULB: 'The wet-bulb temperature cannot be above the dry-bulb temperature.',
  PRESSURE_OUT_OF_RANGE: 'The vapour pressure must be below the total pressure.',
  INVALID_INPUT: 'Some inputs are missing or out of range.',
  UNKNOWN_EQUIPMENT: 'The design refers to equipment that is not in the catalog.',
  UNKNOWN_ROOM: 'A zone refers to a room that is not in the home.',
  UNKNOWN_ZONE: 'A line-set circuit refers to a zone that is not in the design.',
  NOT_A_DATE: 'Enter a calendar date as YYYY-MM-DD.',
  DATE_OUT_OF_RANGE: 'The date must be in the years 1978 to 9999.',
  DATE_BEFORE_TRANSACTION: 'The date checked is before the date of the transaction.',
} as const;

export type CalcErrorCode = keyof typeof CALC_ERROR_MESSAGES;

/** One reported problem inside an INVALID_INPUT error (from a zod issue). */
export interface CalcErrorDetail {
  readonly path: readonly (string | number)[];
  readonly message: string;
}

/** Thrown for invalid input. `message` is always the constant text for `code`. */
export class CalcError extends Error {
  readonly code: CalcErrorCode;
  readonly details: readonly CalcErrorDetail[];

  constructor(code: CalcErrorCode, details: readonly CalcErrorDetail[] = []) {
    super(CALC_ERROR_MESSAGES[code]);
    this.name = 'CalcError';
    this.code = code;
    this.details = details;
  }
}

/** The one assert helper: throws CalcError(code) unless `condition` holds. */
export function assert(condition: boolean, code: CalcErrorCode): asserts condition {
  if (!condition) throw new CalcError(code);
}

/** Kinds of number a public function accepts. */
export type NumberRule = 'any' | 'nonNegative' | 'positive' | 'fraction' | 'nonNegativeInteger';

/**
 * Checks that `value` is a finite number obeying `rule` and returns it typed as number.
 * Accepts `unknown` because callers in JavaScript (or JSON) may pass strings or NaN.
 */
export function num(value: unknown, rule: NumberRule = 'any'): number {
  assert(typeof value === 'number' && !Number.isNaN(value), 'NOT_A_NUMBER');
  assert(Number.isFinite(value), 'NOT_FINITE');
  if (rule === 'nonNegative' || rule === 'nonNegativeInteger') assert(value >= 0, 'NEGATIVE');
  if (rule === 'nonNegativeInteger') assert(Number.isInteger(value), 'NOT_INTEGER');
  if (rule === 'positive') assert(value > 0, 'NOT_POSITIVE');
  if (rule === 'fraction') assert(value >= 0 && value <= 1, 'FRACTION_OUT_OF_RANGE');
  return value;
}
