import { describe, expect, it } from 'vitest';
import {
  catalogModelSchema,
  computeDesign,
  designCatalogFromModels,
  designSchema,
  electricalInputSchema,
  type DesignInput,
} from '@calc';
import { demoCompanyData } from '../../fixtures/demo-company-data';
import { priceBook, pricing, threeRoomHome } from './sample-data';

// Sources for the numbers checked here:
// - Voltage drop of a two-wire run, V = 2 × L × I × R / 1000: Ohm's law over the loop; R for uncoated copper at
//   75 °C from NEC Chapter 9 Table 8 (10 AWG 1.24 Ω and 8 AWG 0.778 Ω per 1000 ft, from memory).
// - The 3 % advised for a branch circuit: NEC 210.19(A) Informational Note (advice, not a rule; from memory).
// - The heat kit's MCA: 5 kW at 240 V = 20.8 A × 1.25 (a continuous load, NEC 424.3(B)) = 26.0 A, the demo's
//   nameplate; 10 AWG NM-B in the 60 °C column (30 A, NEC Table 310.16 and 334.80).
// - Wire length: the run + 1.5 ft per end for terminations, + 10 % waste, rounded up to 5 ft; labor 2 h per
//   circuit + 0.02 h per ft of run (the takeoff's default table, common practice).
const data = demoCompanyData();
const demoCatalog = designCatalogFromModels(data.models.map((m) => catalogModelSchema.parse(m)));

/** The demo's ducted heat pump on its air handler with a 5 kW heat kit; the outdoor unit's run is 40 ft. */
const ducted = (heatKitCircuitLengthFt?: number): DesignInput => ({
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
        ...(heatKitCircuitLengthFt === undefined ? {} : { heatKitCircuitLengthFt }),
      },
    },
  ],
});
const run = (kitFt?: number) =>
  computeDesign({ home: threeRoomHome, design: ducted(kitFt), catalog: demoCatalog, priceBook, pricing });

describe("the heat kit's circuit runs from the panel to the air handler (issue 13)", () => {
  it('its voltage drop is worked over its own run, not the outdoor unit’s', () => {
    const r = run(120);
    const kit = r.systems[0]?.heatKitElectrical;
    // 2 × 120 ft × 26.0 A × 1.24 Ω/1000 ft = 7.74 V = 3.22 % of 240 V: above the advised 3 %;
    // 8 AWG: 2 × 120 × 26.0 × 0.778 / 1000 = 4.85 V = 2.02 % keeps it within.
    expect(kit?.circuitLengthFt).toBe(120);
    expect(kit?.voltageDropV).toBeCloseTo(7.74, 2);
    expect(kit?.voltageDropPercent).toBeCloseTo(3.22, 2);
    expect(kit?.voltageDropAwg).toBe(8);
    expect(kit?.circuitLengthAssumed).toBeNull();
    // The outdoor unit keeps its own 40 ft run: TSL-HP24's 24 A MCA on 10 AWG, 2 × 40 × 24 × 1.24 / 1000 = 2.38 V.
    const outdoor = r.systems[0]?.electrical;
    expect(outdoor?.circuitLengthFt).toBe(40);
    expect(outdoor?.voltageDropV).toBeCloseTo(2.38, 2);
    const why = kit?.explanations.find((e) => e.key === 's1:heat-kit:elec:voltage-drop');
    expect(why?.inputs.find((i) => i.label === 'Run')?.value).toBe(120);
    expect(why?.status).toBe('warning');
  });

  it('the takeoff counts the heat kit’s wire and labor over its own run', () => {
    const r = run(120);
    const line = (k: string) => r.takeoff.find((l) => l.itemKey === k);
    // Both circuits are 10 AWG NM-B: outdoor (40 + 3) × 1.1 = 47.3 → 50 ft; heat kit (120 + 3) × 1.1 = 135.3 → 140 ft.
    expect(line('wire:nm-b:10awg')?.quantity).toBe(190);
    // (2 h + 40 ft × 0.02 h/ft) + (2 h + 120 ft × 0.02 h/ft) = 2.8 h + 4.4 h = 7.2 h.
    expect(line('labor:electrical')?.quantity).toBe(7.2);
  });

  it('until entered, the plan says plainly that the outdoor unit’s run is assumed and shows it', () => {
    const r = run();
    const kit = r.systems[0]?.heatKitElectrical;
    expect(kit?.circuitLengthFt).toBe(40);
    expect(kit?.circuitLengthAssumed).toContain('Panel to air handler not entered');
    expect(kit?.circuitLengthAssumed).toContain("taken as 40 ft, the outdoor unit's run");
    expect(kit?.warnings).toContain(kit?.circuitLengthAssumed);
    expect(r.warnings).toContain(kit?.circuitLengthAssumed);
    const why = kit?.explanations.find((e) => e.key === 's1:heat-kit:elec:voltage-drop');
    expect(why?.inputs.find((i) => i.label === 'Run (assumed)')?.value).toBe(40);
    expect(why?.text).toContain('Panel to air handler not entered');
    // The licensed electrician's caution stays with the heat kit's sizes.
    expect(kit?.caution).toContain('licensed electrician');
    expect(r.systems[0]?.electrical.circuitLengthAssumed).toBeNull();
  });

  it('the run is bounded like the outdoor unit’s, 1 to 300 ft, with a message naming it', () => {
    for (const ft of [0, 0.5, 301]) {
      const p = electricalInputSchema.safeParse({ circuitLengthFt: 40, heatKitCircuitLengthFt: ft });
      expect(p.success).toBe(false);
      expect(p.error?.issues[0]?.message).toBe('Panel to air handler must be between 1 and 300 ft');
      expect(p.error?.issues[0]?.path).toEqual(['heatKitCircuitLengthFt']);
    }
    expect(designSchema.parse(ducted(120)).systems[0]?.electrical.heatKitCircuitLengthFt).toBe(120);
  });
});
