import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { unit } from 'mathjs';
import { formatTape, formatTapeCm, parseTape, TAPE_SIXTEENTHS_PER_FT, type TapeResult } from '@calc';

const feetOf = (r: TapeResult): number => {
  if (!r.ok) throw new Error(`refused: ${r.message}`);
  return r.feet;
};
const refusal = (r: TapeResult): string => (r.ok ? `accepted ${r.feet}` : r.message);

describe('tape-measure entry: feet and inches as people write them', () => {
  // Feet-and-inches notation (' for feet, " for inches, "12-6" for 12 ft 6 in): common practice.
  // 1 ft = 12 in: definition of the international foot (mathjs agrees below).
  it('reads 12 ft 6 in in every usual spelling as 12.5 ft', () => {
    for (const typed of [`12'6"`, `12' 6"`, `12' 6`, `12 ft 6 in`, `12ft6in`, `12 feet 6 inches`, `12-6`, `12 - 6"`]) {
      expect(feetOf(parseTape(typed)), typed).toBe(12.5);
    }
    expect(unit(12, 'ft').toNumber('inch') + 6).toBeCloseTo(150, 9);
  });
  it('reads inches alone and feet alone', () => {
    expect(feetOf(parseTape(`150"`))).toBe(unit(150, 'inch').toNumber('ft'));
    expect(feetOf(parseTape('6 in'))).toBe(0.5);
    expect(feetOf(parseTape('12ft'))).toBe(12);
    expect(feetOf(parseTape(`12'`))).toBe(12);
    expect(feetOf(parseTape('12.5'))).toBe(12.5);
    expect(feetOf(parseTape('  8 ')), 'surrounding spaces').toBe(8);
    expect(feetOf(parseTape('8.')), 'half-typed 8.5').toBe(8);
  });
  it('reads fractions of an inch and the curly quotes phones type', () => {
    expect(feetOf(parseTape(`12' 6 1/2"`))).toBeCloseTo(12 + 6.5 / 12, 12);
    expect(feetOf(parseTape('12-6 1/2'))).toBeCloseTo(12 + 6.5 / 12, 12);
    expect(feetOf(parseTape('3/4"'))).toBeCloseTo(0.75 / 12, 12);
    expect(feetOf(parseTape('12’ 6”'))).toBe(12.5);
    expect(feetOf(parseTape(`12' 6''`))).toBe(12.5);
  });
  it('refuses the ambiguous 12,5 with a question instead of guessing', () => {
    expect(refusal(parseTape('12,5'))).toMatch(/did you mean 12\.5 ft\?/i);
    expect(refusal(parseTape('12,5"'))).toMatch(/did you mean 12\.5 in\?/i);
    expect(refusal(parseTape('3,8', 'metric'))).toMatch(/did you mean 3\.8 m\?/i);
  });
  it('refuses 12 or more inches after feet, and what it cannot read', () => {
    expect(refusal(parseTape(`12' 14"`))).toMatch(/under 12/);
    expect(refusal(parseTape('12-12'))).toMatch(/under 12/);
    expect(refusal(parseTape(`12' 6 3/2"`))).toMatch(/fraction/);
    expect(refusal(parseTape(`12' 6 1/0"`))).toMatch(/fraction/);
    for (const bad of ['abc', '-3', '12 m', '1/2', `12.5' 6"`, '']) {
      expect(parseTape(bad).ok, bad).toBe(false);
    }
  });
  it('metric companies type metres, centimetres or millimetres', () => {
    // Metres to feet through calc's convert-units factor; 1 ft = 0.3048 m (international foot, definition).
    expect(feetOf(parseTape('3.8', 'metric'))).toBeCloseTo(3.8 / 0.3048, 5); // convert-units: 1 m = 3.28084 ft
    expect(feetOf(parseTape('3.8 m', 'metric'))).toBeCloseTo(3.8 / 0.3048, 5); // convert-units: 1 m = 3.28084 ft
    expect(feetOf(parseTape('380 cm', 'metric'))).toBeCloseTo(3.8 / 0.3048, 5); // convert-units: 1 m = 3.28084 ft
    expect(feetOf(parseTape('3800 mm', 'metric'))).toBeCloseTo(3.8 / 0.3048, 5); // convert-units: 1 m = 3.28084 ft
    expect(parseTape(`12'6"`, 'metric').ok).toBe(false);
  });
  it('says what it understood', () => {
    expect(formatTape(12.5)).toBe('12 ft 6 in');
    expect(formatTape(12)).toBe('12 ft');
    expect(formatTape(0.5)).toBe('6 in');
    expect(formatTape(12 + 6.5 / 12)).toBe('12 ft 6 1/2 in');
    expect(formatTape(12 + 6.1875 / 12)).toBe('12 ft 6 3/16 in');
    expect(formatTape(3.8 / 0.3048, 'metric')).toBe('3.8 m');
    expect(formatTapeCm(3.8 / 0.3048)).toBe('380 cm');
  });
});

describe('tape-measure entry: round trips (fast-check)', () => {
  const SIXTEENTH_FT = 1 / TAPE_SIXTEENTHS_PER_FT;
  it('every value on the 1/16 in grid the field can show reads back exactly', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1000 * TAPE_SIXTEENTHS_PER_FT }), (n) => {
        const feet = n / TAPE_SIXTEENTHS_PER_FT;
        expect(feetOf(parseTape(formatTape(feet)))).toBeCloseTo(feet, 10);
      }),
    );
  });
  it('any length reads back within half a sixteenth of an inch', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1000, noNaN: true }), (feet) => {
        expect(Math.abs(feetOf(parseTape(formatTape(feet))) - feet)).toBeLessThanOrEqual(SIXTEENTH_FT / 2 + 1e-9);
      }),
    );
  });
  it('a plain decimal typed in feet is taken as typed', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 100000 }), (hundredths) => {
        const text = (hundredths / 100).toString();
        expect(feetOf(parseTape(text))).toBe(Number(text));
      }),
    );
  });
  it('metric: every centimetre the field can show reads back in m and in cm', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 30000 }), (cm) => {
        const feet = feetOf(parseTape(`${cm} cm`, 'metric'));
        expect(feetOf(parseTape(formatTape(feet, 'metric'), 'metric'))).toBeCloseTo(feet, 9);
        expect(feetOf(parseTape(formatTapeCm(feet), 'metric'))).toBeCloseTo(feet, 9);
      }),
    );
  });
});
