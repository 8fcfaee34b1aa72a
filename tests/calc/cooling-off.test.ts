import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import {
  coolingOffWindow,
  coolingOffHolidays,
  isCoolingOffBusinessDay,
  canStillCancel,
  COOLING_OFF_HOLIDAYS,
  CalcError,
  CALC_ERROR_MESSAGES,
} from '@calc';

/*
 * Sources:
 * - 16 CFR 429.0(g): "Business Day" is any calendar day except Sunday or New Year's Day, Washington's
 *   Birthday, Memorial Day, Independence Day, Labor Day, Columbus Day, Veterans' Day, Thanksgiving Day
 *   and Christmas Day (Saturdays count; the Birthday of Martin Luther King, Jr. and Juneteenth are not named).
 * - 16 CFR 429.1(a): cancel "at any time prior to midnight of the third business day after the date of
 *   this transaction".
 * - 5 U.S.C. 6103(a): the date of each holiday (January 1; third Monday in February; last Monday in May;
 *   July 4; first Monday in September; second Monday in October; November 11; fourth Thursday in
 *   November; December 25).
 * The dates below were worked out by hand from 5 U.S.C. 6103(a) for the years used; weekdays were
 * checked against an outside calendar.
 */
const HOLIDAYS_BY_HAND: Record<number, string[]> = {
  2024: [
    '2024-01-01',
    '2024-02-19',
    '2024-05-27',
    '2024-07-04',
    '2024-09-02',
    '2024-10-14',
    '2024-11-11',
    '2024-11-28',
    '2024-12-25',
  ],
  2025: [
    '2025-01-01',
    '2025-02-17',
    '2025-05-26',
    '2025-07-04',
    '2025-09-01',
    '2025-10-13',
    '2025-11-11',
    '2025-11-27',
    '2025-12-25',
  ],
  2026: [
    '2026-01-01',
    '2026-02-16',
    '2026-05-25',
    '2026-07-04',
    '2026-09-07',
    '2026-10-12',
    '2026-11-11',
    '2026-11-26',
    '2026-12-25',
  ],
  2027: [
    '2027-01-01',
    '2027-02-15',
    '2027-05-31',
    '2027-07-04',
    '2027-09-06',
    '2027-10-11',
    '2027-11-11',
    '2027-11-25',
    '2027-12-25',
  ],
  2028: ['2028-01-01'],
};
const HOLIDAY_SET = new Set(Object.values(HOLIDAYS_BY_HAND).flat());

/** An independent day-by-day counter (Date's own weekday, the hand-written holiday list). */
function deadlineByHand(transactionDate: string): string {
  const d = new Date(`${transactionDate}T00:00:00Z`);
  let counted = 0;
  while (counted < 3) {
    d.setUTCDate(d.getUTCDate() + 1);
    const iso = d.toISOString().slice(0, 10);
    if (d.getUTCDay() !== 0 && !HOLIDAY_SET.has(iso)) counted += 1;
  }
  return d.toISOString().slice(0, 10);
}

describe('holiday dates (16 CFR 429.0(g) names, 5 U.S.C. 6103(a) dates)', () => {
  it('the rule names exactly nine holidays, in its order', () => {
    // 16 CFR 429.0(g)
    expect(COOLING_OFF_HOLIDAYS.map((h) => h.name)).toEqual([
      "New Year's Day",
      "Washington's Birthday",
      'Memorial Day',
      'Independence Day',
      'Labor Day',
      'Columbus Day',
      "Veterans' Day",
      'Thanksgiving Day',
      'Christmas Day',
    ]);
  });
  it.each([2024, 2025, 2026, 2027])('%i: each holiday falls on the date 5 U.S.C. 6103(a) gives it', (year) => {
    expect(coolingOffHolidays(year).map((h) => h.date)).toEqual(HOLIDAYS_BY_HAND[year]);
  });
  it('no observed-day shift: a holiday on a Saturday or Sunday stays on that day (429.0(g) names the day itself)', () => {
    // 5 U.S.C. 6103(a): July 4; 2026-07-04 is a Saturday, 2027-07-04 a Sunday.
    expect(coolingOffHolidays(2026).find((h) => h.key === 'independence-day')?.date).toBe('2026-07-04');
    expect(isCoolingOffBusinessDay('2026-07-03')).toBe(true); // the Friday federal offices observe: counts
    expect(isCoolingOffBusinessDay('2027-07-05')).toBe(true); // the Monday federal offices observe: counts
  });
});

describe('business days (16 CFR 429.0(g))', () => {
  it('Saturday counts, Sunday does not', () => {
    expect(isCoolingOffBusinessDay('2026-12-05')).toBe(true); // Saturday
    expect(isCoolingOffBusinessDay('2026-12-06')).toBe(false); // Sunday
  });
  it('the named holidays do not count; Martin Luther King, Jr. Day and Juneteenth (not named) do', () => {
    expect(isCoolingOffBusinessDay('2026-11-26')).toBe(false); // Thanksgiving Day, 429.0(g)
    expect(isCoolingOffBusinessDay('2026-07-04')).toBe(false); // Independence Day on a Saturday, 429.0(g)
    expect(isCoolingOffBusinessDay('2027-01-18')).toBe(true); // 3rd Monday of January: 5 U.S.C. 6103(a), not in 429.0(g)
    expect(isCoolingOffBusinessDay('2026-06-19')).toBe(true); // June 19: 5 U.S.C. 6103(a), not in 429.0(g)
  });
});

describe('the last day to cancel (16 CFR 429.1(a): midnight of the third business day after the transaction)', () => {
  const last = (date: string) => coolingOffWindow(date).lastDayToCancel;

  it('across a weekend: Thursday sale → Fri, Sat count, Sun skipped → Monday', () => {
    // 16 CFR 429.0(g) (Saturday counts, Sunday does not), 429.1(a)
    expect(last('2026-12-03')).toBe('2026-12-07');
  });
  it('a sale on a Sunday: the sale day itself never counts → Mon, Tue, Wed', () => {
    // 16 CFR 429.1(a): "after the date of this transaction"
    expect(last('2026-12-06')).toBe('2026-12-09');
  });
  it('Wednesday before Thanksgiving → Fri, Sat, (Sun), Mon', () => {
    // 16 CFR 429.0(g) Thanksgiving Day; 5 U.S.C. 6103(a) fourth Thursday in November (2026-11-26)
    const w = coolingOffWindow('2026-11-25');
    expect(w.lastDayToCancel).toBe('2026-11-30');
    expect(w.days.map((d) => d.kind)).toEqual(['holiday', 'business-day', 'business-day', 'sunday', 'business-day']);
    expect(w.days[0]?.holiday).toBe('Thanksgiving Day');
  });
  it('Friday before Memorial Day → Sat, (Sun), (Mon holiday), Tue, Wed', () => {
    // 16 CFR 429.0(g) Memorial Day; 5 U.S.C. 6103(a) last Monday in May (2026-05-25)
    expect(last('2026-05-22')).toBe('2026-05-27');
  });
  it('around Christmas: Wednesday 23 December → Thu 24, (Fri 25), Sat 26, (Sun), Mon 28', () => {
    // 16 CFR 429.0(g) Christmas Day; 5 U.S.C. 6103(a) December 25
    expect(last('2026-12-23')).toBe('2026-12-28');
  });
  it("across New Year's Day and the year's end: Wednesday 30 December → Thu 31, (Fri 1 Jan), Sat 2, (Sun), Mon 4", () => {
    // 16 CFR 429.0(g) New Year's Day; 5 U.S.C. 6103(a) January 1
    expect(last('2026-12-30')).toBe('2027-01-04');
  });
  it('a holiday on a Sunday adds no day: Friday 2 July 2027 → Sat 3, (Sun 4), Mon 5, Tue 6', () => {
    // 16 CFR 429.0(g) Independence Day, not shifted; 5 U.S.C. 6103(a) July 4
    const w = coolingOffWindow('2027-07-02');
    expect(w.lastDayToCancel).toBe('2027-07-06');
    expect(w.days[1]).toEqual({ date: '2027-07-04', kind: 'sunday', holiday: 'Independence Day' });
  });
  it('a holiday on a Saturday takes that Saturday out: Thursday 2 July 2026 → Fri 3, (Sat 4), (Sun), Mon 6, Tue 7', () => {
    // 16 CFR 429.0(g) Independence Day; 5 U.S.C. 6103(a) July 4 (a Saturday in 2026)
    expect(last('2026-07-02')).toBe('2026-07-07');
  });
  it('Martin Luther King, Jr. Day counts: Friday 15 January 2027 → Sat 16, (Sun), Mon 18, Tue 19', () => {
    // 16 CFR 429.0(g) does not name it
    expect(last('2027-01-15')).toBe('2027-01-19');
  });

  it('property: the deadline is after the sale with exactly three business days counted independently', () => {
    const start = Date.UTC(2024, 0, 1);
    const end = Date.UTC(2027, 11, 31);
    fc.assert(
      fc.property(fc.integer({ min: 0, max: (end - start) / 86_400_000 }), (offset) => {
        const sale = new Date(start + offset * 86_400_000).toISOString().slice(0, 10);
        const w = coolingOffWindow(sale);
        expect(w.lastDayToCancel > sale).toBe(true);
        expect(w.lastDayToCancel).toBe(deadlineByHand(sale));
        expect(w.days.filter((d) => d.kind === 'business-day')).toHaveLength(3);
        expect(w.days.at(-1)?.kind).toBe('business-day');
      }),
      { numRuns: 400 },
    );
  });
});

describe('can the buyer still cancel on a given local date (429.1(a))', () => {
  it('yes through the last day, no the day after', () => {
    expect(canStillCancel('2026-11-25', '2026-11-25')).toBe(true);
    expect(canStillCancel('2026-11-25', '2026-11-30')).toBe(true);
    expect(canStillCancel('2026-11-25', '2026-12-01')).toBe(false);
  });
  it('a date before the sale is refused, not answered', () => {
    expect(() => canStillCancel('2026-11-25', '2026-11-24')).toThrow(CALC_ERROR_MESSAGES.DATE_BEFORE_TRANSACTION);
  });
});

describe('bad dates', () => {
  it.each(['2026-02-30', '2026-13-01', '26-11-25', '2026-11-25T10:00', '', 'tomorrow'])('%s → NOT_A_DATE', (bad) => {
    expect(() => coolingOffWindow(bad)).toThrow(CalcError);
    expect(() => coolingOffWindow(bad)).toThrow(CALC_ERROR_MESSAGES.NOT_A_DATE);
  });
  it('not a string → NOT_A_DATE', () => {
    expect(() => coolingOffWindow(20261125 as unknown as string)).toThrow(CALC_ERROR_MESSAGES.NOT_A_DATE);
  });
  it('before 1978 (Veterans Day not yet back on November 11, 5 U.S.C. 6103(a)) → DATE_OUT_OF_RANGE', () => {
    expect(() => coolingOffWindow('1977-11-10')).toThrow(CALC_ERROR_MESSAGES.DATE_OUT_OF_RANGE);
    expect(() => coolingOffHolidays(1977)).toThrow(CALC_ERROR_MESSAGES.DATE_OUT_OF_RANGE);
  });
  it('a leap day is a real date (2028-02-29)', () => {
    // 2028-02-29 is a Tuesday → Wed 1 Mar, Thu 2, Fri 3
    expect(coolingOffWindow('2028-02-29').lastDayToCancel).toBe('2028-03-03');
  });
});
