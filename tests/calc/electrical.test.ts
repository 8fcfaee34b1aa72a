import { describe, it, expect } from 'vitest';
import {
  NEC_310_16_COPPER,
  copperWireAwg,
  copperAmpacityA,
  breakerSizeA,
  mcaFromNameplateA,
  mocpFromNameplateA,
  disconnectWithinSight,
  ambientFactor75C,
  electricalPlan,
  CALC_ERROR_MESSAGES,
  STANDARD_BREAKERS_A,
  CAUTIONS,
} from '@calc';

describe('NEC Table 310.16 copper (60/75/90 °C)', () => {
  // [PUB: NFPA 70 (2023) Table 310.16 as reproduced by wiresizes.com and voltagelab.com]
  const table: [number, number, number, number][] = [
    [14, 15, 20, 25],
    [12, 20, 25, 30],
    [10, 30, 35, 40],
    [8, 40, 50, 55],
    [6, 55, 65, 75],
    [4, 70, 85, 95],
  ];
  it.each(table)('%s AWG: %s / %s / %s A', (awg, c60, c75, c90) => {
    expect(NEC_310_16_COPPER.find((r) => r.awg === awg)).toEqual({ awg, c60, c75, c90 });
    expect(copperAmpacityA({ awg, terminationC: 60 })).toBe(c60);
    expect(copperAmpacityA({ awg, terminationC: 75 })).toBe(c75);
    expect(copperWireAwg({ ampacityA: c60, terminationC: 60 })).toBe(awg);
    expect(copperWireAwg({ ampacityA: c75, terminationC: 75 })).toBe(awg);
  });
  it('above 4 AWG and unknown terminations throw constant messages', () => {
    expect(() => copperWireAwg({ ampacityA: 86, terminationC: 75 })).toThrow(CALC_ERROR_MESSAGES.AMPACITY_ABOVE_TABLE);
    expect(() => copperWireAwg({ ampacityA: 20, terminationC: JSON.parse('90') })).toThrow(
      CALC_ERROR_MESSAGES.UNKNOWN_TERMINATION,
    );
  });
});

describe('electrical check values (reference §10)', () => {
  it('10.1: MCA 18.6, MOCP 30, NM-B → 12 AWG, 30 A; 14 AWG (15 A) fails', () => {
    // [PUB: NEC 440.4(B)/440.35, Table 310.16]
    expect(copperWireAwg({ ampacityA: 18.6, terminationC: 60 })).toBe(12);
    expect(copperAmpacityA({ awg: 14, terminationC: 60 })).toBeLessThan(18.6);
    expect(breakerSizeA({ mcaA: 18.6, mocpA: 30 })).toBe(30);
  });
  it('10.2: MCA 22.5 at 75 °C → 12 AWG; on NM-B (60 °C) → 10 AWG', () => {
    // [PUB: Table 310.16; MEM: NEC 334.80 NM-B at 60 °C]
    expect(copperWireAwg({ ampacityA: 22.5, terminationC: 75 })).toBe(12);
    const plan = electricalPlan({
      mcaA: 22.5,
      mocpA: 35,
      input: {
        terminationC: 75,
        wiringMethod: 'nm-b',
        circuitLengthFt: 30,
        disconnectDistanceFt: 3,
        disconnectVisible: true,
      },
    });
    expect(plan.wireAwg).toBe(10);
    expect(plan.ampacityColumnC).toBe(60);
  });
  it('10.3: MCA 38 at 75 °C → 8 AWG (10 AWG 35 A fails)', () => {
    // [PUB: Table 310.16]
    expect(copperWireAwg({ ampacityA: 38, terminationC: 75 })).toBe(8);
  });
  it('10.4: RLA 14.1 + fan 0.9 → MCA 18.525; MOCP raw 32.6 → 30 A', () => {
    // [PUB: UL 1995 method; MEM: rounding down]
    expect(mcaFromNameplateA({ largestRlaA: 14.1, otherLoadsA: 0.9 })).toBeCloseTo(18.525, 9);
    expect(mocpFromNameplateA({ largestRlaA: 14.1, otherLoadsA: 0.9 })).toBe(30);
  });
  it('10.5: single compressor 18 A → conductor ≥ 22.5 A; OCPD ≤ 31.5 → 30 A', () => {
    // [PUB: NEC 440.32/440.22(A) via ecmweb Q&A]
    expect(mcaFromNameplateA({ largestRlaA: 18, otherLoadsA: 0 })).toBe(22.5); // 125 % of RLA, NEC 440.32
    expect(copperWireAwg({ ampacityA: 22.5, terminationC: 60 })).toBe(10);
    expect(breakerSizeA({ mcaA: 22.5, mocpA: 1.75 * 18 })).toBe(30);
  });
  it('10.6: disconnect 60 ft away and not visible fails 440.14', () => {
    // [PUB: NEC 440.14, Art. 100 "within sight"]
    expect(disconnectWithinSight({ distanceFt: 60, visible: false })).toBe(false);
    expect(disconnectWithinSight({ distanceFt: 50, visible: true })).toBe(true);
    expect(disconnectWithinSight({ distanceFt: 51, visible: true })).toBe(false);
  });
  it('10.7: 12 AWG 75 °C at 38 °C ambient → 25 × 0.88 = 22.0 A', () => {
    // [PUB: Table 310.15(B)(1) via wiresizes.com]
    expect(copperAmpacityA({ awg: 12, terminationC: 75 }) * ambientFactor75C({ ambientC: 38 })).toBeCloseTo(22, 9);
  });
  it('breaker never above MOCP; none fits when MOCP < MCA', () => {
    // [MEM: NEC 240.6(A) standard ratings]
    expect(STANDARD_BREAKERS_A.slice(0, 4)).toEqual([15, 20, 25, 30]);
    expect(breakerSizeA({ mcaA: 12, mocpA: 32 })).toBe(30);
    expect(() => breakerSizeA({ mcaA: 31, mocpA: 33 })).toThrow(CALC_ERROR_MESSAGES.NO_STANDARD_BREAKER);
  });
  it('plan carries the electrician caution, isEstimate and a within-sight warning', () => {
    const plan = electricalPlan({
      mcaA: 18.6,
      mocpA: 30,
      input: {
        terminationC: 60,
        wiringMethod: 'nm-b',
        circuitLengthFt: 40,
        disconnectDistanceFt: 60,
        disconnectVisible: false,
      },
    });
    expect(plan.caution).toBe(CAUTIONS.electrical);
    expect(plan.isEstimate).toBe(true);
    expect(plan.disconnectWithinSight).toBe(false);
    expect(plan.warnings.some((w) => w.includes('within sight'))).toBe(true);
  });
});
