import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  circuitSchema,
  indoorUnitSchema,
  outdoorUnitSchema,
  refrigerantPlan,
  technologyTransitionsCheck,
  type OutdoorUnitInput,
} from '@calc';
import { catalog } from './sample-data';

const head = indoorUnitSchema.parse(catalog.indoorUnits[0]); // 1/4 × 3/8 wall head
const base = catalog.outdoorUnits[0] as OutdoorUnitInput; // R-32, 25 ft per circuit, 0.16 oz/ft
const outdoor = (o: Partial<OutdoorUnitInput> = {}) => outdoorUnitSchema.parse({ ...base, ...o });
const circ = (c: Record<string, unknown>) => ({
  circuit: circuitSchema.parse({ zoneKey: 'z', lengthFt: 30, ...c }),
  indoor: head,
  roomAreaM2: 30,
});

describe('extra charge on the installed length [reference §8: max(0, L − L_pre) × adder]', () => {
  it("the issue's example: 65 ft − 25 ft pre-charged = 40 ft × 0.16 oz/ft = 6.4 oz", () => {
    const p = refrigerantPlan({ outdoor: outdoor(), circuits: [circ({ lengthFt: 65, lineSet: 'field-cut' })] });
    expect(p.circuits[0]?.extraChargeOz).toBe(6.4);
    expect(p.circuits[0]?.explanation.text).toBe('65 ft installed − 25 ft pre-charged = 40 ft × 0.16 oz/ft = 6.4 oz');
  });
  it('reference check 8.4: 60 ft of 3/8 at 0.6 oz/ft, pre-charge 25 ft → 21.0 oz', () => {
    const o = outdoor({ adderOzPerFt: 0.6 });
    const p = refrigerantPlan({
      outdoor: o,
      circuits: [circ({ lengthFt: 60, lineSet: 'field-cut', liquidOdIn: 0.375 })],
    });
    expect(p.circuits[0]?.extraChargeOz).toBe(21);
  });
  it("a pre-flared kit's coiled surplus is charged and noted: 40 ft run in a 50 ft kit → (50 − 25) × 0.16 = 4.0 oz", () => {
    const p = refrigerantPlan({ outdoor: outdoor(), circuits: [circ({ lengthFt: 40 })] });
    expect(p.circuits[0]?.installedLengthFt).toBe(50);
    expect(p.circuits[0]?.extraChargeOz).toBe(4);
    expect(p.notes.some((n) => n.includes('10 ft coiled'))).toBe(true);
    expect(p.circuits[0]?.explanation.text).toBe(
      '50 ft installed (40 ft run + 10 ft of the 50 ft kit coiled) − 25 ft pre-charged = 25 ft × 0.16 oz/ft = 4 oz',
    );
  });
  it('a system-total pre-charge is subtracted once (issue 9: three 40 ft circuits vs 75 ft used to give 0 oz)', () => {
    const o = outdoor({ prechargeBasis: 'system-total', prechargedLengthFt: 75, adderOzPerFt: 0.2 });
    const circuits = ['a', 'b', 'c'].map((k) => circ({ zoneKey: k, lengthFt: 40, lineSet: 'field-cut' }));
    const p = refrigerantPlan({ outdoor: o, circuits });
    // 3 × 40 = 120 ft − 75 ft = 45 ft × 0.2 oz/ft = 9.0 oz, 3.0 oz per circuit
    expect(p.extraChargeOz).toBe(9);
    expect(p.circuits.map((c) => c.extraChargeOz)).toEqual([3, 3, 3]);
    // the same with no maker adder: the estimate still subtracts the pre-charge once.
    // R-32 1/4 in liquid-full at 100 °F = 0.178 oz/ft [reference §8 table]: 45 ft × 0.178 ≈ 8.0 oz
    const est = refrigerantPlan({
      outdoor: outdoor({ prechargeBasis: 'system-total', prechargedLengthFt: 75, adderOzPerFt: undefined }),
      circuits,
    });
    expect(est.extraChargeOz).toBeCloseTo(45 * 0.178, 0);
  });
  it('the adder follows the liquid-line size (issue 9): 3/8 at the maker’s 3/8 rate, never the 1/4 rate', () => {
    const o = outdoor({
      adderOzPerFt: undefined,
      chargeAdders: [
        { liquidOdIn: 0.25, ozPerFt: 0.2 },
        { liquidOdIn: 0.375, ozPerFt: 0.4 },
      ],
    });
    const p = refrigerantPlan({
      outdoor: o,
      circuits: [circ({ lengthFt: 45, lineSet: 'field-cut', liquidOdIn: 0.375 })],
    });
    // maker data: (45 − 25) × 0.4 = 8.0 oz
    expect(p.circuits[0]?.extraChargeOz).toBe(8);
    // no adder for 3/8 given: liquid-full estimate for R-32 3/8 at 100 °F = 0.476 oz/ft [reference §8 table], labelled
    const only14 = outdoor({ adderOzPerFt: 0.16, liquidOdIn: 0.25 });
    const q = refrigerantPlan({
      outdoor: only14,
      circuits: [circ({ lengthFt: 45, lineSet: 'field-cut', liquidOdIn: 0.375 })],
    });
    expect(q.circuits[0]?.adderSource).toBe('estimate');
    expect(Math.abs((q.circuits[0]?.adderOzPerFt ?? 0) - 0.476)).toBeLessThanOrEqual(0.003);
  });
  it('charge never falls as a line gets longer (property, both pre-charge bases)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 200 }),
        fc.integer({ min: 0, max: 100 }),
        fc.boolean(),
        fc.boolean(),
        (len, more, system, kit) => {
          const o = outdoor({ prechargeBasis: system ? 'system-total' : 'per-circuit', maxLineLengthFt: 300 });
          const c = (l: number) => circ({ lengthFt: l, lineSet: kit ? 'kit' : 'field-cut' });
          const a = refrigerantPlan({
            outdoor: o,
            circuits: [c(len), circ({ zoneKey: 'y', lengthFt: 30 })],
          }).extraChargeOz;
          const b = refrigerantPlan({
            outdoor: o,
            circuits: [c(len + more), circ({ zoneKey: 'y', lengthFt: 30 })],
          }).extraChargeOz;
          expect(b).toBeGreaterThanOrEqual(a);
        },
      ),
    );
  });
});

describe('limits (maker data; the design cannot be marked ready past them)', () => {
  it('height between indoor units: 10 ft above and 25 ft below the outdoor unit are 35 ft apart', () => {
    const o = outdoor({ maxIndoorHeightDiffFt: 33 });
    const p = refrigerantPlan({
      outdoor: o,
      circuits: [
        circ({ zoneKey: 'up', liftFt: 10 }),
        circ({ zoneKey: 'down', liftFt: 25, liftDirection: 'indoor-below' }),
      ],
    });
    expect(p.indoorHeightDifferenceFt).toBe(35);
    expect(p.blockers.some((b) => b.includes('35 ft apart'))).toBe(true);
  });
  it('run, total and lift limits are blockers', () => {
    const p = refrigerantPlan({
      outdoor: outdoor(),
      circuits: [
        circ({ zoneKey: 'a', lengthFt: 90, lineSet: 'field-cut', liftFt: 50 }),
        circ({ zoneKey: 'b', lengthFt: 80, lineSet: 'field-cut' }),
      ],
    });
    // maker: 82 ft per circuit, 165 ft total, 49 ft lift (sample data)
    expect(p.blockers).toHaveLength(3);
  });
});

describe('Technology Transitions rule [PUB: 40 CFR 84 Subpart B; reference §11 checks 11.5 and 11.6]', () => {
  it('11.5: R-410A split installed 2025-06-01 with components made in 2024 is allowed', () => {
    expect(
      technologyTransitionsCheck({ refrigerant: 'R-410A', installDate: '2025-06-01', componentsMadeBefore2025: true })
        .verdict,
    ).toBe('allowed-old-components');
  });
  it('11.6: a new R-410A split installed 2026-02-01 is not (GWP 2088 ≥ 700), and says the rule may change', () => {
    const r = technologyTransitionsCheck({ refrigerant: 'R-410A', installDate: '2026-02-01' });
    expect(r.blocker).toBe(true);
    expect(r.message).toContain('40 CFR Part 84 Subpart B');
    expect(r.message).toContain('may change');
  });
  it('R-32 (GWP 675) and R-454B (466) are below the limit; no date gives a warning, not a blocker', () => {
    expect(technologyTransitionsCheck({ refrigerant: 'R-32', installDate: '2027-01-01' }).verdict).toBe('allowed');
    expect(technologyTransitionsCheck({ refrigerant: 'R-454B' }).verdict).toBe('allowed');
    expect(technologyTransitionsCheck({ refrigerant: 'R-410A' })).toMatchObject({
      verdict: 'check-date',
      blocker: false,
    });
  });
});
