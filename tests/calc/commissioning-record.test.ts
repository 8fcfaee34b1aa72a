import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  CALC_ERROR_MESSAGES,
  DEFAULT_EVACUATION_POLICY,
  evacuationReading,
  extraChargeOz,
  holdTrend,
  psigToPsia,
  recomputedExtraCharge,
  standingTestReading,
} from '@calc';

describe('gauge to absolute pressure', () => {
  it('300 psig = 314.696 psia', () => {
    // [PUB: 1 atm = 14.696 psia, SI/NIST; reference check 6.8: 300 psig = 314.696 psia]
    expect(psigToPsia(300)).toBeCloseTo(314.696, 9);
  });
  it('a gauge reading below a perfect vacuum is refused', () => {
    // [PUB: absolute pressure cannot be negative; 0 psia = −14.696 psig]
    expect(() => standingTestReading({ startPsig: -15, startF: 70, endPsig: 0, endF: 70, resolutionPsi: 1 })).toThrow(
      CALC_ERROR_MESSAGES.NEGATIVE,
    );
  });
});

describe('standing nitrogen test, corrected for temperature', () => {
  it('9.3: 300 psig at 70 °F read 294 psig at 60 °F — the drop is the cooling', () => {
    // [PUB: ideal-gas law at constant volume; reference check 9.3: 294.06 psig expected, drop 5.94 psi]
    const r = standingTestReading({ startPsig: 300, startF: 70, endPsig: 294, endF: 60, resolutionPsi: 1 });
    expect(Math.abs(r.expectedEndPsig - 294.06)).toBeLessThanOrEqual(0.05);
    expect(r.outcome).toBe('drop-explained-by-temperature');
    expect(r.pass).toBe(true);
    expect(r.words).toMatch(/no pressure was lost/);
  });
  it('9.3 again, but read 290 psig: about 4 psi more than the cooling explains → lost pressure', () => {
    // [PUB: reference check 9.3 — 294.06 expected; 294.06 − 290 = 4.06 psi unexplained, above a 1 psi gauge division]
    const r = standingTestReading({ startPsig: 300, startF: 70, endPsig: 290, endF: 60, resolutionPsi: 1 });
    expect(r.outcome).toBe('lost-pressure');
    expect(r.pass).toBe(false);
    expect(Math.abs(r.unexplainedPsi - 4.06)).toBeLessThanOrEqual(0.05);
  });
  it('a reading that rose more than the warming explains asks for the readings to be checked', () => {
    // [PUB: ideal-gas law; 150 psig at 70 °F warmed to 80 °F gives (164.696 × 539.67/529.67) − 14.696 = 153.11 psig, worked by hand]
    const r = standingTestReading({ startPsig: 150, startF: 70, endPsig: 160, endF: 80, resolutionPsi: 1 });
    expect(Math.abs(r.expectedEndPsig - 153.11)).toBeLessThanOrEqual(0.01);
    expect(r.outcome).toBe('check-readings');
  });
  it('property: the expected end keeps P/T constant in absolute units (Gay-Lussac)', () => {
    // [PUB: ideal-gas law PV = nRT at fixed V, n → P₁/T₁ = P₂/T₂ in psia and °R]
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 600, noNaN: true }),
        fc.double({ min: -20, max: 120, noNaN: true }),
        fc.double({ min: -20, max: 120, noNaN: true }),
        (p, t1, t2) => {
          const r = standingTestReading({ startPsig: p, startF: t1, endPsig: p, endF: t2, resolutionPsi: 1 });
          const lhs = (p + 14.696) / (t1 + 459.67);
          const rhs = (r.expectedEndPsig + 14.696) / (t2 + 459.67);
          expect(Math.abs(lhs - rhs) / lhs).toBeLessThan(1e-12);
        },
      ),
    );
  });
  it('property: reading exactly the expected pressure passes; losing two gauge divisions more fails', () => {
    // [PUB: UL-derived instructions — no decrease over the hold, read on the gauge (reference §9)]
    fc.assert(
      fc.property(
        fc.double({ min: 50, max: 600, noNaN: true }),
        fc.double({ min: 0, max: 110, noNaN: true }),
        fc.double({ min: 0, max: 110, noNaN: true }),
        fc.double({ min: 0.5, max: 10, noNaN: true }),
        (p, t1, t2, res) => {
          const expected = standingTestReading({
            startPsig: p,
            startF: t1,
            endPsig: p,
            endF: t2,
            resolutionPsi: res,
          }).expectedEndPsig;
          expect(
            standingTestReading({ startPsig: p, startF: t1, endPsig: expected, endF: t2, resolutionPsi: res }).pass,
          ).toBe(true);
          expect(
            standingTestReading({ startPsig: p, startF: t1, endPsig: expected - 2 * res, endF: t2, resolutionPsi: res })
              .outcome,
          ).toBe('lost-pressure');
        },
      ),
    );
  });
});

describe('evacuation against the policy', () => {
  it('the default policy is the UL-derived instruction: 500 microns, ≤ 1,500 within 10 minutes', () => {
    // [PUB: UL 60335-2-40-derived manual instructions, reference §9]
    expect(DEFAULT_EVACUATION_POLICY).toEqual({ targetMicrons: 500, maxRiseToMicrons: 1500, holdMinutes: 10 });
  });
  it('9.2: 480 → 1,450 microns in 10 min passes the 1,500 rule and fails a 1,000-micron policy', () => {
    // [PUB: reference check 9.2; common practice: the 1,000-micron decay policy]
    expect(evacuationReading({ reachedMicrons: 480, afterHoldMicrons: 1450, holdMinutes: 10 }).outcome).toBe('pass');
    const strict = evacuationReading({
      reachedMicrons: 480,
      afterHoldMicrons: 1450,
      holdMinutes: 10,
      policy: { targetMicrons: 500, maxRiseToMicrons: 1000, holdMinutes: 10 },
    });
    expect(strict.outcome).toBe('rose-too-far');
    expect(strict.pass).toBe(false);
  });
  it('not reaching 500 microns fails before the hold is looked at', () => {
    // [PUB: reference §9 — evacuate to the lesser of 500 microns or the code value]
    expect(evacuationReading({ reachedMicrons: 650, afterHoldMicrons: 700, holdMinutes: 10 }).outcome).toBe(
      'not-reached',
    );
  });
  it('a hold shorter than the policy is not a pass', () => {
    // [PUB: reference §9 — the rise is judged "within 10 minutes" of isolating the pump]
    expect(evacuationReading({ reachedMicrons: 400, afterHoldMicrons: 600, holdMinutes: 5 }).outcome).toBe(
      'hold-too-short',
    );
  });
  it('rose and levelled → moisture or outgassing; kept rising → a leak', () => {
    // [PUB: transport-refrigeration "pressure rise test" — levels off below atmospheric = moisture,
    // keeps climbing = leak (reference §9); the quarter/half rate thresholds are common practice]
    const levelled = [
      { minute: 0, microns: 450 },
      { minute: 2, microns: 700 },
      { minute: 6, microns: 770 },
      { minute: 10, microns: 780 },
    ];
    expect(holdTrend(levelled)).toBe('levelled');
    const tight = evacuationReading({
      reachedMicrons: 450,
      afterHoldMicrons: 780,
      holdMinutes: 10,
      holdReadings: levelled,
      policy: { targetMicrons: 500, maxRiseToMicrons: 700, holdMinutes: 10 },
    });
    expect(tight.outcome).toBe('rose-too-far');
    expect(tight.words).toMatch(/levelled at 780 microns: moisture or outgassing — evacuate again/);
    const rising = [
      { minute: 0, microns: 450 },
      { minute: 5, microns: 1800 },
      { minute: 10, microns: 3200 },
    ];
    expect(holdTrend(rising)).toBe('kept-rising');
    expect(
      evacuationReading({ reachedMicrons: 450, afterHoldMicrons: 3200, holdMinutes: 10, holdReadings: rising }).words,
    ).toMatch(/kept rising through the hold: a leak/);
    expect(holdTrend(rising.slice(0, 2))).toBe('not-enough-readings');
  });
  it('a negative micron reading is refused', () => {
    // [PUB: an absolute pressure in microns of mercury cannot be below zero (reference §1)]
    expect(() => evacuationReading({ reachedMicrons: -1, afterHoldMicrons: 600, holdMinutes: 10 })).toThrow(
      CALC_ERROR_MESSAGES.NEGATIVE,
    );
  });
  it('property: a lower reading after the hold never turns a pass into a fail', () => {
    // [PUB: reference §9 — the limit is an upper bound on the rise]
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 500 }), fc.integer({ min: 0, max: 5000 }), (reached, after) => {
        const a = evacuationReading({ reachedMicrons: reached, afterHoldMicrons: after, holdMinutes: 10 });
        const b = evacuationReading({ reachedMicrons: reached, afterHoldMicrons: after / 2, holdMinutes: 10 });
        if (a.pass) expect(b.pass).toBe(true);
      }),
    );
  });
});

describe('extra charge recomputed from the measured lengths', () => {
  it('8.4: measured 60 ft of 3/8 at 0.6 oz/ft, pre-charge 25 ft → 21.0 oz; planned 45 ft → 12.0 oz', () => {
    // [PUB: reference check 8.4 — 35 ft × 0.6 = 21.0 oz; 20 ft × 0.6 = 12.0 oz by the same formula]
    const r = recomputedExtraCharge({
      circuits: [{ key: 'a', plannedInstalledFt: 45, measuredFt: 60, ozPerFt: 0.6 }],
      prechargedLengthFt: 25,
      prechargeBasis: 'per-circuit',
      weighedInOz: 18,
    });
    expect(r.plannedOz).toBeCloseTo(12, 9);
    expect(r.extraOz).toBeCloseTo(21, 9);
    expect(r.differenceOz).toBeCloseTo(-3, 9);
    expect(r.words).toMatch(/3 oz less/);
  });
  it('8.7: a circuit shorter than the pre-charge adds nothing (no removal)', () => {
    // [PUB: reference check 8.7 — 10 ft with 15 ft pre-charge, "no removal" → 0 oz]
    const r = recomputedExtraCharge({
      circuits: [{ key: 'a', plannedInstalledFt: 20, measuredFt: 10, ozPerFt: 0.2 }],
      prechargedLengthFt: 15,
      prechargeBasis: 'per-circuit',
      weighedInOz: null,
    });
    expect(r.extraOz).toBe(0);
    expect(r.differenceOz).toBeNull();
  });
  it('system-total pre-charge: subtracted once, shared by length, each at its own adder', () => {
    // [reference §8 formula; worked by hand: 40 + 35 = 75 ft − 50 ft = 25 ft beyond;
    //  share 40/75 × 25 = 13.33 ft × 0.2 = 2.67 → 2.7 oz; 35/75 × 25 = 11.67 ft × 0.3 = 3.5 oz]
    const r = recomputedExtraCharge({
      circuits: [
        { key: 'a', plannedInstalledFt: 30, measuredFt: 40, ozPerFt: 0.2 },
        { key: 'b', plannedInstalledFt: 35, measuredFt: null, ozPerFt: 0.3 },
      ],
      prechargedLengthFt: 50,
      prechargeBasis: 'system-total',
      weighedInOz: 6.2,
    });
    expect(r.circuits.map((c) => c.extraOz)).toEqual([2.7, 3.5]);
    expect(r.extraOz).toBeCloseTo(6.2, 9);
    expect(r.differenceOz).toBe(0);
  });
  it('property: per-circuit, each circuit equals calc’s extraChargeOz rounded to 0.1 oz', () => {
    // [reference §8: max(0, L − L_pre) × adder; rounding half-up to 0.1 oz as refrigerantPlan does]
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 200 }),
        fc.integer({ min: 0, max: 50 }),
        fc.integer({ min: 0, max: 100 }),
        (len, pre, adderHundredths) => {
          const ozPerFt = adderHundredths / 100;
          const r = recomputedExtraCharge({
            circuits: [{ key: 'a', plannedInstalledFt: 25, measuredFt: len, ozPerFt }],
            prechargedLengthFt: pre,
            prechargeBasis: 'per-circuit',
            weighedInOz: null,
          });
          const direct = Math.max(0, len - pre) * ozPerFt;
          expect(Math.abs(r.extraOz - direct)).toBeLessThanOrEqual(0.05 + 1e-9);
          expect(r.extraOz).toBeCloseTo(
            Math.round(extraChargeOz({ lengthFt: len, prechargedLengthFt: pre, ozPerFt }) * 10 + 1e-9) / 10,
            9,
          );
        },
      ),
    );
  });
});
