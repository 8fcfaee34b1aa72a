import { describe, expect, it } from 'vitest';
import {
  catalogModelSchema,
  computeDesign,
  designCatalogFromModels,
  disconnectRun,
  electricalPlan,
  electricalInputSchema,
  type DesignInput,
} from '@calc';
import { demoCompanyData } from '../../fixtures/demo-company-data';
import { catalog, design, priceBook, pricing, threeRoomHome } from './sample-data';

// Sources for the numbers checked here:
// - NEC 440.14: the disconnecting means is located within sight from and readily accessible from the
//   air-conditioning equipment; "within sight" = visible and not more than 50 ft away (NEC Art. 100). As
//   quoted in EC&M's Code Q&A on 440.14 (ecmweb.com/nec/code-qa-54).
// - NEC 350.30(A): liquid-tight flexible metal conduit is securely fastened within 1 ft of each termination
//   and at intervals not exceeding 4½ ft; up to 3 ft (trade sizes ½–1¼) may be left unsecured where
//   flexibility is needed. As quoted in EC&M's Code Q&A "NEC Requirements for Support of LFMC" (2021).
// - The 6 ft pre-made whip and 1 ft per end for the bend into a fitting: common practice.
const twelve = { hot: { count: 2, awg: 12 }, ground: { count: 1, awg: 12 } };

describe('from the disconnect to the unit (issue 13)', () => {
  it('a whip when the disconnect is within its 6 ft reach (common practice)', () => {
    for (const d of [0, 4, 6]) {
      const r = disconnectRun({ distanceFt: d, set: twelve });
      expect(r.kind).toBe('whip');
      expect(r.lengthFt).toBe(6);
      expect(r.supports).toBe(0);
    }
  });

  it('beyond it, a liquid-tight run supported within 1 ft of each end and every 4½ ft (NEC 350.30(A))', () => {
    const r = disconnectRun({ distanceFt: 15, set: twelve });
    expect(r.kind).toBe('field-run');
    // 15 ft + 2 × 1 ft = 17 ft → 20 ft (sold by 5 ft); supports at 1 ft from each end leave 18 ft between,
    // in spans of at most 4.5 ft: 18 ÷ 4.5 = 4 spans → 5 supports.
    expect(r.lengthFt).toBe(20);
    expect(r.supports).toBe(5);
    // 6.5 ft: 8.5 → 10 ft; 8 ft between → 2 spans → 3 supports.
    expect(disconnectRun({ distanceFt: 6.5, set: twelve })).toMatchObject({ lengthFt: 10, supports: 3 });
    // Three 12 AWG THHN (0.0133 in² each, NEC Ch. 9 Table 5, from memory) = 0.0399 in² ≤ 40 % of ½ in LFMC.
    expect(r.size).toBe('1/2');
  });

  it('the plan warns with its sources beside the cautions; beyond 50 ft it is not within sight (NEC 440.14, Art. 100)', () => {
    const input = (d: number) => electricalInputSchema.parse({ circuitLengthFt: 40, disconnectDistanceFt: d });
    const near = electricalPlan({ mcaA: 18.6, mocpA: 30, input: input(5) });
    expect(near.warnings).toEqual([]);
    expect(near.disconnectRun?.kind).toBe('whip');
    const far = electricalPlan({ mcaA: 18.6, mocpA: 30, input: input(15) });
    expect(far.disconnectWithinSight).toBe(true);
    const w = far.warnings.join(' ');
    expect(w).toContain('a 6 ft whip does not reach');
    expect(w).toContain('NEC 350.30(A)');
    expect(w).toContain('NEC 440.14');
    expect(w).toContain('A licensed electrician confirms');
    expect(far.caution).toContain('licensed electrician');
    const why = far.explanations.find((e) => e.key === 'elec:disconnect-run');
    expect(why?.status).toBe('warning');
    expect(why?.source).toContain('NEC 350.30(A)');
    const tooFar = electricalPlan({ mcaA: 18.6, mocpA: 30, input: input(55) });
    expect(tooFar.disconnectWithinSight).toBe(false);
    expect(tooFar.explanations.find((e) => e.key === 'elec:disconnect')?.status).toBe('blocker');
  });

  it("the takeoff counts the run's conduit, connectors, supports, conductors and labor instead of the whip", () => {
    const far: DesignInput = {
      ...design,
      systems: design.systems.map((s) => ({ ...s, electrical: { ...s.electrical, disconnectDistanceFt: 15 } })),
    };
    const r = computeDesign({ home: threeRoomHome, design: far, catalog, priceBook, pricing });
    const qty = (k: string) => r.takeoff.find((l) => l.itemKey === k)?.quantity;
    expect(qty('whip:1/2x6ft')).toBeUndefined();
    expect(qty('raceway:lfmc:1/2')).toBe(20);
    expect(qty('fitting:lfmc:1/2')).toBe(2);
    expect(qty('strap:lfmc:1/2')).toBe(5);
    // MCA 18.6 A on NM-B → 12 AWG, 30 A breaker (design.test); the run's conductors are THHN: each
    // (20 ft + 2 × 1.5 ft terminations) × 1.1 waste = 25.3 ft; two hots 50.6 → 55 ft, the ground 25.3 → 30 ft
    // (12 AWG: NEC Table 250.122 gives 10 AWG for 30 A, never larger than the circuit conductors — from memory).
    expect(qty('wire:thhn-conduit:12awg')).toBe(55);
    expect(qty('wire:thhn-conduit-ground:12awg')).toBe(30);
    // Labor table: 2 h + (42 ft circuit + 20 ft run) × 0.02 h/ft = 3.24 h (the default table, common practice).
    expect(qty('labor:electrical')).toBe(3.24);
    expect(r.warnings.some((x) => x.includes('a 6 ft whip does not reach'))).toBe(true);
  });
});

describe("the heat kit's own circuit has its disconnect and whip (issue 13)", () => {
  const data = demoCompanyData();
  const demoCatalog = designCatalogFromModels(data.models.map((m) => catalogModelSchema.parse(m)));
  const ducted = (heatKitDisconnectDistanceFt?: number): DesignInput => ({
    zones: [{ key: 'z1', name: 'House', roomIds: ['living', 'kitchen', 'bed'], indoorUnitKey: 'TSL-AH36' }],
    systems: [
      {
        key: 's1',
        name: 'Ducted',
        outdoorUnitKey: 'TSL-HP24',
        heatKitKey: 'TSL-HK5',
        circuits: [{ zoneKey: 'z1', lengthFt: 25 }],
        electrical: {
          circuitLengthFt: 40,
          disconnectDistanceFt: 4,
          ...(heatKitDisconnectDistanceFt === undefined ? {} : { heatKitDisconnectDistanceFt }),
        },
      },
    ],
  });
  const run = (d?: number) =>
    computeDesign({ home: threeRoomHome, design: ducted(d), catalog: demoCatalog, priceBook, pricing });

  it('beside the air handler: a second disconnect and whip, sized for the kit, and the circuit’s labor', () => {
    const r = run();
    const kit = r.systems[0]?.heatKitElectrical;
    // 5 kW at 240 V = 20.8 A × 1.25 = 26.0 A MCA (the demo's nameplate), MOCP 30 A → 10 AWG on NM-B (60 °C
    // column: 30 A) and a 30 A breaker; a 60 A disconnect; three 10 AWG = 0.0633 in² ≤ 40 % of ½ in LFMC.
    expect(kit).toMatchObject({ wireAwg: 10, breakerA: 30, disconnectA: 60 });
    expect(kit?.disconnectRun).toMatchObject({ kind: 'whip', size: '1/2', lengthFt: 6 });
    const line = (k: string) => r.takeoff.find((l) => l.itemKey === k);
    // The outdoor unit's disconnect (60 A, 1/2 in whip) and the kit's are two of each.
    expect(line('disconnect:60a')?.quantity).toBe(2);
    expect(line('disconnect:60a')?.derivation).toContain('within sight of the air handler');
    expect(line('whip:1/2x6ft')?.quantity).toBe(2);
    // Two branch circuits of 40 ft: 2 × (2 h + 40 ft × 0.02 h/ft) = 5.6 h (the default labor table).
    expect(line('labor:electrical')?.quantity).toBe(5.6);
  });

  it('a heat-kit disconnect farther than a whip reaches gets the liquid-tight run and its warning', () => {
    const r = run(12);
    expect(r.systems[0]?.heatKitElectrical?.disconnectRun).toMatchObject({ kind: 'field-run', lengthFt: 15 });
    expect(r.warnings.some((w) => w.includes('from the heat kit: a 6 ft whip does not reach'))).toBe(true);
    expect(r.takeoff.find((l) => l.itemKey === 'raceway:lfmc:1/2')?.quantity).toBe(15);
  });
});
