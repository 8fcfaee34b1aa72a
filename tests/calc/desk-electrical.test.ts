import { describe, expect, it } from 'vitest';
import { COPPER_OHMS_PER_KFT_75C, electricalInputSchema, electricalPlan, voltageDropV } from '@calc';

// Outside check of the resistance table: AWG diameter d = 0.005 in × 92^((36 − n)/39) [PUB: ASTM B258 AWG
// definition]; annealed copper 100 % IACS = 1/58 Ω·mm²/m at 20 °C with α = 0.00393 /°C [PUB: IACS standard,
// 1913]; converted to Ω·cmil/ft and corrected to 75 °C. Stranded conductors run about 2 % above solid
// (lay of the strands), so the table may sit 0–5 % above this solid-wire figure.
const CMIL_PER_MM2 = 1 / 5.067075e-4; // 1 cmil = π/4 × (0.001 in × 25.4 mm/in)² mm²
const rhoCmilFt75 = (1 / 58) * CMIL_PER_MM2 * 0.3048 * (1 + 0.00393 * (75 - 20));
const solidOhmsPerKft = (awg: number) => {
  const dMil = 5 * 92 ** ((36 - awg) / 39);
  return (rhoCmilFt75 * 1000) / (dMil * dMil);
};

describe('copper resistance at 75 °C (NEC Ch. 9 Table 8, from memory) against the physics', () => {
  it.each([14, 12, 10, 8, 6, 4])('%s AWG stranded is 0–5 % above solid by the AWG and IACS definitions', (awg) => {
    const ratio = (COPPER_OHMS_PER_KFT_75C[awg] ?? 0) / solidOhmsPerKft(awg);
    expect(ratio).toBeGreaterThanOrEqual(1);
    expect(ratio).toBeLessThanOrEqual(1.05);
  });
});

describe('voltage drop over the run [Ohm’s law over the out-and-back loop]', () => {
  it('12 AWG, 42 ft, 18.6 A: 2 × 42 × 18.6 × 1.98 / 1000 = 3.093552 V = 1.29 % of 240 V', () => {
    expect(voltageDropV({ awg: 12, lengthFt: 42, currentA: 18.6 })).toBeCloseTo(3.093552, 6);
    const p = electricalPlan({ mcaA: 18.6, mocpA: 30, input: electricalInputSchema.parse({ circuitLengthFt: 42 }) });
    expect(p.voltageDropPercent).toBe(1.29);
    expect(p.explanations.find((e) => e.key === 'elec:voltage-drop')?.text).toBe(
      '2 × 42 ft × 18.6 A × 1.98 Ω/1000 ft = 3.09 V = 1.3 % of 240 V',
    );
  });
  it('a long run above 3 % names the conductor that keeps it within (NEC 210.19(A) note, advice)', () => {
    // 12 AWG, 150 ft, 18.6 A: 2 × 150 × 18.6 × 1.98 / 1000 = 11.05 V = 4.6 % of 240; 10 AWG: 6.92 V = 2.9 %
    const p = electricalPlan({ mcaA: 18.6, mocpA: 30, input: electricalInputSchema.parse({ circuitLengthFt: 150 }) });
    expect(p.wireAwg).toBe(12);
    expect(p.voltageDropAwg).toBe(10);
    expect(p.warnings.some((w) => w.includes('10 AWG keeps it within 3 %'))).toBe(true);
  });
  it('reference 10.1: MCA 18.6 A, MOCP 30 A on NM-B → 12 AWG, 30 A, with the why', () => {
    const p = electricalPlan({ mcaA: 18.6, mocpA: 30, input: electricalInputSchema.parse({ circuitLengthFt: 30 }) });
    expect(p.explanations.find((e) => e.key === 'elec:conductor')?.text).toBe(
      'MCA 18.6 A → smallest copper with ampacity ≥ MCA in the 60 °C column: 12 AWG (20 A), NM-B cable (60 °C column)',
    );
    expect(p.explanations.find((e) => e.key === 'elec:breaker')?.valueText).toBe('30 A two-pole');
  });
});
