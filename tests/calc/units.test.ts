import { describe, it, expect } from 'vitest';
import { unit } from 'mathjs';
import convert from 'convert-units';
import {
  BTUH_PER_TON,
  BTUH_PER_W,
  btuhFromW,
  wFromBtuh,
  tonsFromBtuh,
  btuhFromTons,
  ftFromM,
  mFromFt,
  cFromF,
  fFromC,
  kelvinDeltaFromF,
  gPerMFromOzPerFt,
  ozPerFtFromGPerM,
  lpsFromCfm,
  kpaFromPsi,
  paFromMicrons,
  ft2FromM2,
  m2FromFt2,
} from '@calc';

describe('unit conversions (reference §6), cross-checked with mathjs', () => {
  it('6.1: 1 ton = 12,000 Btu/h = 3.5169 kW ± 0.0001', () => {
    // [PUB: definition of the ton]
    expect(BTUH_PER_TON).toBe(12000);
    expect(Math.abs(wFromBtuh({ btuh: btuhFromTons({ tons: 1 }) }) / 1000 - 3.5169)).toBeLessThanOrEqual(0.0001);
    expect(unit(12000, 'BTU/hour').toNumber('kW')).toBeCloseTo(wFromBtuh({ btuh: 12000 }) / 1000, 4);
  });
  it('6.2: 36,000 Btu/h = 3.0 tons = 10.551 kW', () => {
    // [PUB: SI/NIST]
    expect(tonsFromBtuh({ btuh: 36000 })).toBe(3);
    expect(wFromBtuh({ btuh: 36000 }) / 1000).toBeCloseTo(10.551, 3);
  });
  it('6.3: 1 W = 3.41214 Btu/h; 1 kW = 3412.14 (mathjs agrees)', () => {
    // [PUB: SI/NIST]
    expect(btuhFromW({ w: 1 })).toBeCloseTo(3.41214, 5);
    expect(btuhFromW({ w: 1000 })).toBeCloseTo(3412.14, 2);
    expect(unit(1, 'W').toNumber('BTU/hour')).toBeCloseTo(BTUH_PER_W, 4);
  });
  it('6.4: mini-split sizes 9/12/18/24 kBtu/h → 2.638 / 3.517 / 5.275 / 7.034 kW ± 0.001', () => {
    // [PUB: SI/NIST]
    const expected: [number, number][] = [
      [9000, 2.638],
      [12000, 3.517],
      [18000, 5.275],
      [24000, 7.034],
    ];
    for (const [btuh, kw] of expected) expect(Math.abs(wFromBtuh({ btuh }) / 1000 - kw)).toBeLessThanOrEqual(0.001);
  });
  it('6.6/9.1: 500 microns = 66.66 Pa (convert-units torr)', () => {
    // [PUB: 1 micron = 1 mTorr = 0.133322 Pa]
    expect(paFromMicrons({ microns: 500 })).toBeCloseTo(66.66, 1);
    expect(paFromMicrons({ microns: 760000 })).toBeCloseTo(101325, -1);
  });
  it('6.8: 1 psi = 6.894757 kPa; 300 psig = 2,169.7 kPa abs', () => {
    // [PUB: SI/NIST]
    expect(kpaFromPsi({ psi: 1 })).toBeCloseTo(6.894757, 4);
    expect(kpaFromPsi({ psi: 314.696 })).toBeCloseTo(2169.7, 0);
  });
  it('6.9/8.8: 0.6 oz/ft = 55.81 g/m; 15 g/m = 0.161 oz/ft; 0.16 oz/ft = 14.9 g/m; 7.5 m = 24.6 ft', () => {
    // [PUB: SI/NIST; 1 oz/ft = 93.010 g/m]
    expect(gPerMFromOzPerFt({ ozPerFt: 0.6 })).toBeCloseTo(55.81, 1);
    expect(ozPerFtFromGPerM({ gPerM: 15 })).toBeCloseTo(0.161, 3);
    expect(gPerMFromOzPerFt({ ozPerFt: 0.16 })).toBeCloseTo(14.9, 1);
    expect(ftFromM({ m: 7.5 })).toBeCloseTo(24.6, 1);
    expect(gPerMFromOzPerFt({ ozPerFt: 1 })).toBeCloseTo(93.01, 2);
  });
  it('6.10: 1 CFM = 0.47195 L/s; 400 CFM = 188.8 L/s (mathjs agrees)', () => {
    // [PUB: SI/NIST]
    expect(lpsFromCfm({ cfm: 1 })).toBeCloseTo(0.47195, 4);
    expect(lpsFromCfm({ cfm: 400 })).toBeCloseTo(188.8, 1);
    expect(unit(400, 'ft^3/minute').toNumber('L/s')).toBeCloseTo(lpsFromCfm({ cfm: 400 }), 3);
  });
  it('6.12/6.13: 95/75/100 °F → 35.0/23.89/37.78 °C; a 20 °F difference is 11.11 K, not 266.5', () => {
    // [PUB: SI/NIST]
    expect(cFromF({ f: 95 })).toBeCloseTo(35, 6);
    expect(cFromF({ f: 75 })).toBeCloseTo(23.89, 2);
    expect(cFromF({ f: 100 })).toBeCloseTo(37.78, 2);
    expect(fFromC({ c: 35 })).toBeCloseTo(95, 6);
    expect(kelvinDeltaFromF({ deltaF: 20 })).toBeCloseTo(11.11, 2);
  });
  it('length and area round trips through convert-units', () => {
    expect(ftFromM({ m: mFromFt({ ft: 17.25 }) })).toBeCloseTo(17.25, 9);
    expect(ft2FromM2({ m2: m2FromFt2({ ft2: 300 }) })).toBeCloseTo(300, 9);
    // convert-units 2.3.4 goes through its metric↔imperial anchor (1 m = 3.28084 ft), so
    // 1 ft comes out 0.30479999 m: a 3e-8 relative error, far below any trade tolerance.
    expect(convert(1).from('ft').to('m')).toBeCloseTo(0.3048, 7);
  });
});
