import { describe, it, expect } from 'vitest';
import psychrolib from 'psychrolib';
import {
  altitudeFactor,
  dewPointF,
  grainsFromHumidityRatio,
  humidityRatioFromRh,
  humidityRatioFromWetBulb,
  latentHeatBtuh,
  moistAirEnthalpyBtuPerLb,
  saturationPressurePsia,
  sensibleHeatBtuh,
  standardPressurePsia,
  infiltrationCfm,
  ventilationCfm62_2,
  naturalAchFromAch50,
  airflowForSensibleCfm,
  SENSIBLE_CONSTANT,
  LATENT_CONSTANT,
} from '@calc';

psychrolib.SetUnitSystem(psychrolib.IP);
const P = 14.696;

describe('air-stream heat (reference §1)', () => {
  it('1.1: 1 CFM heated 32 → 52 °F at 1.08 = 21.6 Btu/h', () => {
    // [PUB: engineeringtoolbox worked example]
    expect(sensibleHeatBtuh({ cfm: 1, deltaTF: 20 })).toBeCloseTo(21.6, 2);
  });
  it('1.2: 1000 CFM, ΔT 20 → 21,600 at the declared 1.08; 1.10 form gives 22,000 (within 2 %)', () => {
    // [PUB: derivation 0.075 × 60 × 0.24 = 1.08; ASHRAE 1.10 within a wider band]
    expect(SENSIBLE_CONSTANT).toBe(1.08);
    expect(sensibleHeatBtuh({ cfm: 1000, deltaTF: 20 })).toBeCloseTo(21600, 0);
    expect(Math.abs(sensibleHeatBtuh({ cfm: 1000, deltaTF: 20 }) - 22000) / 22000).toBeLessThan(0.02);
  });
  it('1.6/1.7: 100 CFM outdoor air 95/75 into 75 °F/50 %: sensible 2,160, latent 2,299 ± 3', () => {
    // [PUB: psychrolib-computed check values in reference §1; 0.68 constant from engineeringtoolbox]
    const wIn = humidityRatioFromRh({ dryBulbF: 75, rh: 0.5, pressurePsia: P });
    const wOut = humidityRatioFromWetBulb({ dryBulbF: 95, wetBulbF: 75, pressurePsia: P });
    const dgr = grainsFromHumidityRatio({ humidityRatio: wOut - wIn });
    expect(sensibleHeatBtuh({ cfm: 100, deltaTF: 20 })).toBeCloseTo(2160, 6);
    expect(LATENT_CONSTANT).toBe(0.68);
    expect(Math.abs(latentHeatBtuh({ cfm: 100, deltaGrains: dgr }) - 2299)).toBeLessThanOrEqual(3);
  });
  it('1.8: total 4.5 × CFM × Δh = 4,594 ± 5; sensible + latent is within 3 % of it', () => {
    // [PUB: 4.5 = 60 × 0.075; reference §1 notes the −2.9 % gap]
    const wIn = humidityRatioFromRh({ dryBulbF: 75, rh: 0.5, pressurePsia: P });
    const wOut = humidityRatioFromWetBulb({ dryBulbF: 95, wetBulbF: 75, pressurePsia: P });
    const dh =
      moistAirEnthalpyBtuPerLb({ dryBulbF: 95, humidityRatio: wOut }) -
      moistAirEnthalpyBtuPerLb({ dryBulbF: 75, humidityRatio: wIn });
    const total = 4.5 * 100 * dh;
    expect(Math.abs(total - 4594)).toBeLessThanOrEqual(5);
    const parts =
      sensibleHeatBtuh({ cfm: 100, deltaTF: 20 }) +
      latentHeatBtuh({ cfm: 100, deltaGrains: grainsFromHumidityRatio({ humidityRatio: wOut - wIn }) });
    expect(Math.abs(parts - total) / total).toBeLessThan(0.03);
  });
  it('rejects NaN, strings and negative CFM with the constant message', () => {
    expect(() => sensibleHeatBtuh({ cfm: Number.NaN, deltaTF: 1 })).toThrow('Enter a number.');
    expect(() => sensibleHeatBtuh({ cfm: JSON.parse('"10"'), deltaTF: 1 })).toThrow('Enter a number.');
    expect(() => latentHeatBtuh({ cfm: -1, deltaGrains: 1 })).toThrow('The value must not be negative.');
  });
});

describe('psychrometrics vs psychrolib (ASHRAE 2017 ch. 1)', () => {
  it('1.3: 75 °F / 50 % → 0.0092357 lb/lb = 64.65 gr ± 0.05', () => {
    // [PUB: psychrolib 1.1.1 computed, reference §1]
    const w = humidityRatioFromRh({ dryBulbF: 75, rh: 0.5, pressurePsia: P });
    expect(w).toBeCloseTo(0.0092357, 6);
    expect(Math.abs(grainsFromHumidityRatio({ humidityRatio: w }) - 64.65)).toBeLessThanOrEqual(0.05);
    expect(w).toBeCloseTo(psychrolib.GetHumRatioFromRelHum(75, 0.5, P), 9);
  });
  it('1.4: 95 db / 75 wb → 0.0140652 = 98.46 gr ± 0.05', () => {
    // [PUB: psychrolib 1.1.1 computed, reference §1]
    const w = humidityRatioFromWetBulb({ dryBulbF: 95, wetBulbF: 75, pressurePsia: P });
    expect(w).toBeCloseTo(0.0140652, 6);
    expect(Math.abs(grainsFromHumidityRatio({ humidityRatio: w }) - 98.46)).toBeLessThanOrEqual(0.05);
    expect(w).toBeCloseTo(psychrolib.GetHumRatioFromTWetBulb(95, 75, P), 9);
  });
  it('1.5: enthalpies 28.107 / 38.316 Btu/lb ± 0.01', () => {
    // [PUB: psychrolib 1.1.1 computed, reference §1]
    expect(moistAirEnthalpyBtuPerLb({ dryBulbF: 75, humidityRatio: 0.0092357 })).toBeCloseTo(28.107, 2);
    expect(moistAirEnthalpyBtuPerLb({ dryBulbF: 95, humidityRatio: 0.0140652 })).toBeCloseTo(38.316, 2);
  });
  it('1.9: dew point of 75 °F / 50 % = 55.12 °F ± 0.05', () => {
    // [PUB: psychrolib 1.1.1 computed, reference §1]
    const w = humidityRatioFromRh({ dryBulbF: 75, rh: 0.5, pressurePsia: P });
    expect(Math.abs(dewPointF({ humidityRatio: w, pressurePsia: P }) - 55.12)).toBeLessThanOrEqual(0.05);
  });
  it('1.10: saturated W at 55 °F = 64.36 gr ± 0.05', () => {
    // [PUB: psychrolib 1.1.1 computed, reference §1]
    const w = humidityRatioFromRh({ dryBulbF: 55, rh: 1, pressurePsia: P });
    expect(Math.abs(grainsFromHumidityRatio({ humidityRatio: w }) - 64.36)).toBeLessThanOrEqual(0.05);
  });
  it('1.11: 5000 ft → 12.228 psia ± 0.002, altitude factor 0.8321, 1.08 × it = 0.899', () => {
    // [PUB: ASHRAE 2017 ch. 1 eq. 3 via psychrolib GetStandardAtmPressure]
    expect(Math.abs(standardPressurePsia({ elevationFt: 5000 }) - 12.228)).toBeLessThanOrEqual(0.002);
    expect(altitudeFactor({ elevationFt: 5000 })).toBeCloseTo(0.8321, 4);
    expect(1.08 * altitudeFactor({ elevationFt: 5000 })).toBeCloseTo(0.899, 3);
    expect(standardPressurePsia({ elevationFt: 5000 })).toBeCloseTo(psychrolib.GetStandardAtmPressure(5000), 9);
  });
  it('saturation pressure and wet-bulb humidity ratio match psychrolib across −20…110 °F (ice and water branches)', () => {
    // [PUB: psychrolib implements the same ASHRAE 2017 ch. 1 equations]
    for (let t = -20; t <= 110; t += 5) {
      expect(saturationPressurePsia({ dryBulbF: t }) / psychrolib.GetSatVapPres(t)).toBeCloseTo(1, 9);
    }
    for (const [db, wb] of [
      [95, 75],
      [105, 70],
      [85, 80],
      [40, 30],
      [20, 15],
    ] as const) {
      const ours = grainsFromHumidityRatio({
        humidityRatio: humidityRatioFromWetBulb({ dryBulbF: db, wetBulbF: wb, pressurePsia: P }),
      });
      const theirs = psychrolib.GetHumRatioFromTWetBulb(db, wb, P) * 7000;
      expect(Math.abs(ours - theirs)).toBeLessThan(0.01);
    }
  });
  it('grains difference at 5000 ft matches psychrolib', () => {
    // [PUB: psychrolib as outside reference]
    const p = standardPressurePsia({ elevationFt: 5000 });
    const ours = grainsFromHumidityRatio({
      humidityRatio:
        humidityRatioFromWetBulb({ dryBulbF: 95, wetBulbF: 65, pressurePsia: p }) -
        humidityRatioFromRh({ dryBulbF: 75, rh: 0.45, pressurePsia: p }),
    });
    const theirs =
      (psychrolib.GetHumRatioFromTWetBulb(95, 65, p) - psychrolib.GetHumRatioFromRelHum(75, 0.45, p)) * 7000;
    expect(Math.abs(ours - theirs)).toBeLessThan(0.01);
  });
  it('wet bulb above dry bulb is a calc error', () => {
    expect(() => humidityRatioFromWetBulb({ dryBulbF: 70, wetBulbF: 75, pressurePsia: P })).toThrow(
      'The wet-bulb temperature cannot be above the dry-bulb temperature.',
    );
  });
  it('1.13 SI check (psychrolib SI mode): 24 °C / 50 % → 0.0092985 kg/kg ± 2e-6 equals our IP result', () => {
    // [PUB: psychrolib SI mode, reference §1 check 1.13]; humidity ratio is unit-free
    const ours = humidityRatioFromRh({ dryBulbF: 24 * 1.8 + 32, rh: 0.5, pressurePsia: 101325 / 6894.757 });
    expect(Math.abs(ours - 0.0092985)).toBeLessThan(2e-6);
  });
});

describe('infiltration and ventilation (reference §5, §7)', () => {
  it('5.1: 1,344 ft³ at 0.5 ACH = 11.2 CFM', () => {
    // [PUB: air-change formula]
    expect(infiltrationCfm({ volumeFt3: 12 * 14 * 8, ach: 0.5 })).toBeCloseTo(11.2, 6);
  });
  it('5.2: ΔT 20, Δgr 33.81 → sensible 241.9, latent 257.5 ± 0.5', () => {
    // [PUB: §1 constants applied to 5.1]
    const cfm = infiltrationCfm({ volumeFt3: 1344, ach: 0.5 });
    expect(Math.abs(sensibleHeatBtuh({ cfm, deltaTF: 20 }) - 241.9)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(latentHeatBtuh({ cfm, deltaGrains: 33.81 }) - 257.5)).toBeLessThanOrEqual(0.5);
  });
  it('5.3: heating ΔT 70 → 846.7', () => {
    // [PUB: §1 constants]
    expect(sensibleHeatBtuh({ cfm: 11.2, deltaTF: 70 })).toBeCloseTo(846.7, 1);
  });
  it('5.4: 20,000 ft³ at 0.5 ACH = 166.7 CFM ± 0.1', () => {
    // [PUB: public heat-load sheet example]
    expect(Math.abs(infiltrationCfm({ volumeFt3: 20000, ach: 0.5 }) - 166.7)).toBeLessThanOrEqual(0.1);
  });
  it('5.5: 62.2 ventilation 2,000 ft², 3 bedrooms = 90 CFM', () => {
    // from memory [MEM: ASHRAE 62.2-2013]
    expect(ventilationCfm62_2({ floorAreaFt2: 2000, bedrooms: 3 })).toBeCloseTo(90, 9);
  });
  it('5.6: ACH50 5.0 / N 20 = 0.25 natural ACH', () => {
    // common practice [TRADE]
    expect(naturalAchFromAch50({ ach50: 5 })).toBe(0.25);
  });
  it('7.5: sensible 24,000, supply ΔT 20 → 1,111 CFM ± 1', () => {
    // common practice [TRADE]
    expect(Math.abs(airflowForSensibleCfm({ sensibleBtuh: 24000, supplyDeltaTF: 20 }) - 1111)).toBeLessThanOrEqual(1);
  });
});
