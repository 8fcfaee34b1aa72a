/**
 * The buyer's three-business-day right to cancel a sale made at the home: the US FTC
 * Cooling-Off Rule, 16 CFR Part 429 ("Rule Concerning Cooling-Off Period for Sales Made at
 * Homes or at Certain Other Locations").
 *
 * Pure calendar arithmetic on local civil dates (the job site's date, YYYY-MM-DD). No clock and
 * no time zones: the server turns a signing instant into the site's local date before it calls
 * here, and compares the site's local "today" with the answer.
 *
 * What the rule's text says, and how it is read here:
 * - 16 CFR 429.0(g) defines a business day as any calendar day except Sunday or these business
 *   holidays: New Year's Day, Washington's Birthday, Memorial Day, Independence Day, Labor Day,
 *   Columbus Day, Veterans' Day, Thanksgiving Day and Christmas Day. So Saturdays count. Birthday
 *   of Martin Luther King, Jr. and Juneteenth National Independence Day are federal holidays in
 *   5 U.S.C. 6103(a) but are NOT named by 429.0(g): they are business days for this rule.
 * - 16 CFR 429.1(a): the buyer may cancel "at any time prior to midnight of the third business day
 *   after the date of this transaction". The counting starts the day after the transaction date
 *   (the transaction date itself never counts, whatever day it is), and the window ends at the
 *   end of the third business day (local midnight).
 * - The holiday dates come from 5 U.S.C. 6103(a): January 1; third Monday in February; last
 *   Monday in May; July 4; first Monday in September; second Monday in October; November 11;
 *   fourth Thursday in November; December 25. (Veterans Day has been November 11 again since
 *   1978, so years before 1978 are refused.)
 * - No observed-day shifts. 429.0(g) names the holidays themselves, not the days federal offices
 *   observe them (the Friday/Monday shift is 5 U.S.C. 6103(b) and Executive Order 11582, written
 *   for federal employees' pay and leave, which the rule does not refer to). So a holiday that falls
 *   on a Sunday adds nothing (Sunday is already excluded) and the Monday after it is a business day;
 *   one that falls on a Saturday makes that Saturday a non-business day and the Friday before it
 *   stays a business day.
 *
 * State law may give more time (16 CFR 429.2 leaves stricter state laws in force); that is the
 * company's own wording, not computed here.
 */
import { CalcError } from '../errors';

/** The holidays 16 CFR 429.0(g) names, in its order, with the 5 U.S.C. 6103(a) date rule of each. */
export const COOLING_OFF_HOLIDAYS = [
  { key: 'new-years-day', name: "New Year's Day", rule: { kind: 'fixed', month: 1, day: 1 } },
  { key: 'washingtons-birthday', name: "Washington's Birthday", rule: { kind: 'nth', month: 2, weekday: 1, nth: 3 } },
  { key: 'memorial-day', name: 'Memorial Day', rule: { kind: 'last', month: 5, weekday: 1 } },
  { key: 'independence-day', name: 'Independence Day', rule: { kind: 'fixed', month: 7, day: 4 } },
  { key: 'labor-day', name: 'Labor Day', rule: { kind: 'nth', month: 9, weekday: 1, nth: 1 } },
  { key: 'columbus-day', name: 'Columbus Day', rule: { kind: 'nth', month: 10, weekday: 1, nth: 2 } },
  { key: 'veterans-day', name: "Veterans' Day", rule: { kind: 'fixed', month: 11, day: 11 } },
  { key: 'thanksgiving-day', name: 'Thanksgiving Day', rule: { kind: 'nth', month: 11, weekday: 4, nth: 4 } },
  { key: 'christmas-day', name: 'Christmas Day', rule: { kind: 'fixed', month: 12, day: 25 } },
] as const;

export type CoolingOffHolidayKey = (typeof COOLING_OFF_HOLIDAYS)[number]['key'];

/** How many business days the buyer has (16 CFR 429.1(a), (b)). */
export const COOLING_OFF_BUSINESS_DAYS = 3;

/** Years the holiday rules above hold for (Veterans Day back on November 11 from 1978). */
export const COOLING_OFF_FIRST_YEAR = 1978;
export const COOLING_OFF_LAST_YEAR = 9999;

const DATE_PATTERN = /^(\d{4})-(\d{2})-(\d{2})$/;

/**
 * Days since 1970-01-01 of a proleptic Gregorian civil date, by the standard era arithmetic
 * (400-year eras of 146,097 days; March-based years so the leap day falls at the year's end).
 */
function dayNumber(year: number, month: number, day: number): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400;
  const mp = (month + 9) % 12;
  const doy = Math.floor((153 * mp + 2) / 5) + day - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146_097 + doe - 719_468;
}

/** The civil date of a day number (the inverse of `dayNumber`). */
function fromDayNumber(n: number): { year: number; month: number; day: number } {
  const z = n + 719_468;
  const era = Math.floor(z / 146_097);
  const doe = z - era * 146_097;
  const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36_524) - Math.floor(doe / 146_096)) / 365);
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
  const mp = Math.floor((5 * doy + 2) / 153);
  const day = doy - Math.floor((153 * mp + 2) / 5) + 1;
  const month = mp < 10 ? mp + 3 : mp - 9;
  return { year: yoe + era * 400 + (month <= 2 ? 1 : 0), month, day };
}

function isoOf(n: number): string {
  const { year, month, day } = fromDayNumber(n);
  return `${String(year).padStart(4, '0')}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

/** 0 = Sunday … 6 = Saturday. 1970-01-01 was a Thursday. */
function weekdayOf(n: number): number {
  return (((n + 4) % 7) + 7) % 7;
}

/** Checks a local civil date written YYYY-MM-DD (a real calendar day, 1978–9999) and returns its day number. */
function parseLocalDate(value: unknown): number {
  if (typeof value !== 'string') throw new CalcError('NOT_A_DATE');
  const m = DATE_PATTERN.exec(value);
  if (!m) throw new CalcError('NOT_A_DATE');
  const [year, month, day] = [Number(m[1]), Number(m[2]), Number(m[3])];
  if (month < 1 || month > 12 || day < 1 || day > 31) throw new CalcError('NOT_A_DATE');
  const n = dayNumber(year, month, day);
  const back = fromDayNumber(n);
  if (back.month !== month || back.day !== day) throw new CalcError('NOT_A_DATE');
  if (year < COOLING_OFF_FIRST_YEAR || year > COOLING_OFF_LAST_YEAR) throw new CalcError('DATE_OUT_OF_RANGE');
  return n;
}

type HolidayRule = (typeof COOLING_OFF_HOLIDAYS)[number]['rule'];

function holidayDay(year: number, rule: HolidayRule): number {
  if (rule.kind === 'fixed') return dayNumber(year, rule.month, rule.day);
  if (rule.kind === 'nth') {
    const first = dayNumber(year, rule.month, 1);
    const offset = (rule.weekday - weekdayOf(first) + 7) % 7;
    return first + offset + (rule.nth - 1) * 7;
  }
  const last = dayNumber(year, rule.month + 1, 1) - 1; // 'last' rules are May only: month + 1 ≤ 12
  return last - ((weekdayOf(last) - rule.weekday + 7) % 7);
}

export interface CoolingOffHoliday {
  readonly key: CoolingOffHolidayKey;
  readonly name: string;
  /** YYYY-MM-DD, the holiday itself (no observed-day shift). */
  readonly date: string;
}

/** The nine 16 CFR 429.0(g) holidays of one year, dated by 5 U.S.C. 6103(a). */
export function coolingOffHolidays(year: number): CoolingOffHoliday[] {
  if (!Number.isInteger(year)) throw new CalcError('NOT_INTEGER');
  if (year < COOLING_OFF_FIRST_YEAR || year > COOLING_OFF_LAST_YEAR) throw new CalcError('DATE_OUT_OF_RANGE');
  return COOLING_OFF_HOLIDAYS.map((h) => ({ key: h.key, name: h.name, date: isoOf(holidayDay(year, h.rule)) }));
}

function holidayOn(n: number): CoolingOffHoliday | null {
  const { year } = fromDayNumber(n);
  return coolingOffHolidays(year).find((h) => h.date === isoOf(n)) ?? null;
}

export type CoolingOffDayKind = 'business-day' | 'sunday' | 'holiday';

export interface CoolingOffDay {
  readonly date: string;
  readonly kind: CoolingOffDayKind;
  /** The holiday's name when the day is one of the 429.0(g) holidays (a Sunday holiday too). */
  readonly holiday: string | null;
}

function classify(n: number): CoolingOffDay {
  const holiday = holidayOn(n);
  const kind: CoolingOffDayKind = weekdayOf(n) === 0 ? 'sunday' : holiday ? 'holiday' : 'business-day';
  return { date: isoOf(n), kind, holiday: holiday?.name ?? null };
}

/** Whether a local date is a business day under 16 CFR 429.0(g): not a Sunday and not a named holiday. */
export function isCoolingOffBusinessDay(localDate: string): boolean {
  return classify(parseLocalDate(localDate)).kind === 'business-day';
}

export interface CoolingOffWindow {
  /** The transaction's local date as given (the site's date when the buyer signed). */
  readonly transactionDate: string;
  /** The last local date on which the buyer may cancel: until midnight at its end (429.1(a)). */
  readonly lastDayToCancel: string;
  /** Each calendar day after the transaction through the last day, with why it counts or not. */
  readonly days: readonly CoolingOffDay[];
}

/**
 * The window of 16 CFR 429.1(a): the third business day (429.0(g)) after the transaction date.
 * Throws CalcError NOT_A_DATE / DATE_OUT_OF_RANGE for a bad date.
 */
export function coolingOffWindow(transactionDate: string): CoolingOffWindow {
  const start = parseLocalDate(transactionDate);
  const days: CoolingOffDay[] = [];
  let counted = 0;
  let n = start;
  while (counted < COOLING_OFF_BUSINESS_DAYS) {
    n += 1;
    const day = classify(n);
    days.push(day);
    if (day.kind === 'business-day') counted += 1;
  }
  if (fromDayNumber(n).year > COOLING_OFF_LAST_YEAR) throw new CalcError('DATE_OUT_OF_RANGE');
  return { transactionDate: isoOf(start), lastDayToCancel: isoOf(n), days };
}

/**
 * Whether the buyer may still cancel on `todayLocal` (the site's local date now): on any day up to
 * and including the last day (the window closes at that day's midnight, 429.1(a)). A date before
 * the transaction (a clock or data error) is refused rather than answered.
 */
export function canStillCancel(transactionDate: string, todayLocal: string): boolean {
  const today = parseLocalDate(todayLocal);
  const start = parseLocalDate(transactionDate);
  if (today < start) throw new CalcError('DATE_BEFORE_TRANSACTION');
  return today <= parseLocalDate(coolingOffWindow(transactionDate).lastDayToCancel);
}
