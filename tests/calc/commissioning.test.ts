import { describe, it, expect } from 'vitest';
import {
  nitrogenTestPsigAt,
  evacuationVerdict,
  maxGaugeResolutionPsi,
  condensateFallIn,
  condensateGalPerHour,
  condensateLbPerHour,
  CALC_ERROR_MESSAGES,
} from '@calc';

describe('pressure test and evacuation (reference §9)', () => {
  it('9.3: 300 psig at 70 °F cooling to 60 °F → 294.06 psig ± 0.05', () => {
    // [PUB: ideal-gas law, reference check 9.3]
    expect(Math.abs(nitrogenTestPsigAt({ psig: 300, fromF: 70, toF: 60 }) - 294.06)).toBeLessThanOrEqual(0.05);
  });
  it('same temperature → same pressure', () => {
    expect(nitrogenTestPsigAt({ psig: 150, fromF: 75, toF: 75 })).toBeCloseTo(150, 9);
  });
  it('9.2: 480 → 1,450 microns: passes the 1,500 rule, fails a 1,000 trade policy', () => {
    // [PUB: UL-derived instructions 500 / 1,500 microns; TRADE: 1,000-micron decay policy]
    expect(
      evacuationVerdict({ reachedMicrons: 480, afterHoldMicrons: 1450, targetMicrons: 500, maxRiseToMicrons: 1500 }),
    ).toEqual({ reached: true, held: true, pass: true });
    expect(
      evacuationVerdict({ reachedMicrons: 480, afterHoldMicrons: 1450, targetMicrons: 500, maxRiseToMicrons: 1000 }),
    ).toEqual({ reached: true, held: false, pass: false });
    expect(
      evacuationVerdict({ reachedMicrons: 650, afterHoldMicrons: 700, targetMicrons: 500, maxRiseToMicrons: 1500 }),
    ).toEqual({ reached: false, held: true, pass: false });
  });
  it('9.4: 150 psig test → gauge resolution ≤ 7.5 psi', () => {
    // [PUB: UL-derived A2L instructions, 5 % of test pressure]
    expect(maxGaugeResolutionPsi({ testPsig: 150 })).toBeCloseTo(7.5, 9);
  });
  it('rejects strings', () => {
    expect(() => nitrogenTestPsigAt({ psig: JSON.parse('"300"'), fromF: 70, toF: 60 })).toThrow(
      CALC_ERROR_MESSAGES.NOT_A_NUMBER,
    );
  });
});

describe('condensate (reference §12)', () => {
  it('2-ton, SHR 0.75 → 6,000 Btu/h latent → 5.66 lb/h → 0.68 gal/h ± 0.02', () => {
    // [PUB: h_we 1,060 Btu/lb, engineeringtoolbox; ACCA blog]
    expect(condensateLbPerHour({ latentBtuh: 6000 })).toBeCloseTo(5.66, 2);
    expect(Math.abs(condensateGalPerHour({ latentBtuh: 6000 }) - 0.68)).toBeLessThanOrEqual(0.02);
  });
  it('30 ft drain: calc uses 1/8 in per ft (IMC 307.2.1) → 3.75 in (a strict 1 % would be 3.6)', () => {
    // [PUB: IMC 307.2.1]
    expect(condensateFallIn({ lengthFt: 30 })).toBeCloseTo(3.75, 9);
  });
});
