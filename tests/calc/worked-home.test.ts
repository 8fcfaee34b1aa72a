import { describe, it, expect } from 'vitest';
import { homeLoad, roomLoad } from '@calc';
import { bedroom, conditions, kitchen, livingRoom, threeRoomHome } from './sample-data';

/*
 * Worked example: an invented three-room house, every number checked by hand.
 * Site: 95 °F db / 75 °F wb summer, 10 °F winter, indoor 75 °F / 50 % and 70 °F, daily
 * range 20 °F, sea level (altitude factor 1). Tightness "average" → 0.5 ACH.
 *   ΔT cooling = 95 − 75 = 20 °F; ΔT heating = 70 − 10 = 60 °F.
 *   Glass cooling ΔT = 20 − 0.46 × 20 = 10.8 °F.
 *   Grains: indoor 64.650, outdoor 98.456 → Δgr 33.807 (psychrolib-checked, reference 1.3/1.4).
 *   Attic ceiling cooling ΔT = 20 + 30 (attic adder) = 50 °F.
 *   People: 70 W × 3.412141633 = 238.850 Btu/h sensible; 45 W → 153.546 Btu/h latent.
 * Components round half-up to 1 Btu/h; totals are sums of the rounded components.
 */

describe('worked example: three-room house', () => {
  it('living room 20 × 15 × 8 ft: S wall 20 ft with 60×48 in low-e window (blinds), W wall 15 ft with 15 ft² clear window and a 36×80 in steel door; R-38 attic; slab; 3 people; 150 W TV', () => {
    const r = roomLoad({ room: livingRoom, designConditions: conditions });
    // Floor 300 ft², volume 2,400 ft³, infiltration 0.5 × 2400 / 60 = 20.0 CFM
    expect(r.floorAreaFt2).toBe(300);
    expect(r.volumeFt3).toBe(2400);
    expect(r.infiltrationCfm).toBe(20);
    // Walls: S gross 160 − 20 window = 140; W gross 120 − 15 − 20 door = 85 → 225 ft² × 0.083
    //   cooling 225 × 0.083 × 20 = 373.5 → 374; heating × 60 = 1,120.5 → 1,121
    // Window conduction: (20 × 0.30 + 15 × 0.55) × 10.8 = (6 + 8.25) × 10.8 = 153.9 → 154; heating 14.25 × 60 = 855
    // Sun: S 20 × 0.30 × 100 × 0.70 = 420; W 15 × 0.67 × 215 × 1.0 = 2,160.75 → 2,580.75 → 2,581
    // Door: 20 ft² × 0.20 × 20 = 80; heating × 60 = 240
    // Ceiling: 300 × 0.030 × 50 = 450; heating 300 × 0.030 × 60 = 540
    // Slab: cooling 0; heating 0.73 × (20 + 15) ft exposed perimeter × 60 = 1,533
    // Infiltration: 1.08 × 20 × 20 = 432; latent 0.68 × 20 × 33.807 = 459.77 → 460; heating 1.08 × 20 × 60 = 1,296
    // People: 3 × 238.850 = 716.55 → 717; latent 3 × 153.546 = 460.64 → 461
    // TV: 150 × 3.412141633 = 511.82 → 512
    expect(r.sensibleGain).toEqual({
      walls: 374,
      windowsConduction: 154,
      windowsSolar: 2581,
      doors: 80,
      ceiling: 450,
      floor: 0,
      infiltration: 432,
      people: 717,
      appliances: 512,
      total: 5300,
    });
    expect(r.latentGain).toEqual({
      walls: 0,
      windowsConduction: 0,
      windowsSolar: 0,
      doors: 0,
      ceiling: 0,
      floor: 0,
      infiltration: 460,
      people: 461,
      appliances: 0,
      total: 921,
    });
    expect(r.heatLoss).toEqual({
      walls: 1121,
      windowsConduction: 855,
      windowsSolar: 0,
      doors: 240,
      ceiling: 540,
      floor: 1533,
      infiltration: 1296,
      people: 0,
      appliances: 0,
      total: 5585,
    });
    expect(r.coolingTotalBtuh).toBe(6221);
    expect(r.isEstimate).toBe(true);
  });

  it('bedroom 12 × 12 × 8 ft: N wall 12 ft with 36×48 in low-e window (drapes); R-38 attic; slab; 2 people', () => {
    const r = roomLoad({ room: bedroom, designConditions: conditions });
    // Walls: 96 − 12 = 84 ft² × 0.083 × 20 = 139.44 → 139; × 60 = 418.32 → 418
    // Window: 12 × 0.30 × 10.8 = 38.88 → 39; heating 12 × 0.30 × 60 = 216
    // Sun: 12 × 0.30 × 40 (north) × 0.65 (drapes) = 93.6 → 94
    // Ceiling: 144 × 0.030 × 50 = 216; heating 144 × 0.030 × 60 = 259.2 → 259
    // Slab: 0.73 × 12 × 60 = 525.6 → 526
    // Infiltration: 0.5 × 1152 / 60 = 9.6 CFM; 1.08 × 9.6 × 20 = 207.36 → 207; latent 0.68 × 9.6 × 33.807 = 220.69 → 221; heating 622.08 → 622
    // People: 2 × 238.850 = 477.70 → 478; latent 2 × 153.546 = 307.09 → 307
    expect(r.sensibleGain).toEqual({
      walls: 139,
      windowsConduction: 39,
      windowsSolar: 94,
      doors: 0,
      ceiling: 216,
      floor: 0,
      infiltration: 207,
      people: 478,
      appliances: 0,
      total: 1173,
    });
    expect(r.latentGain.total).toBe(528);
    expect(r.heatLoss).toEqual({
      walls: 418,
      windowsConduction: 216,
      windowsSolar: 0,
      doors: 0,
      ceiling: 259,
      floor: 526,
      infiltration: 622,
      people: 0,
      appliances: 0,
      total: 2041,
    });
  });

  it('kitchen 10 × 12 × 8 ft: E wall 10 ft with a 10 ft² low-e window; conditioned above; vented crawl with R-19 below; 1,200 Btu/h range allowance', () => {
    const r = roomLoad({ room: kitchen, designConditions: conditions });
    // Walls: 80 − 10 = 70 ft² × 0.083 × 20 = 116.2 → 116; × 60 = 348.6 → 349
    // Window: 10 × 0.30 × 10.8 = 32.4 → 32; heating 180
    // Sun: 10 × 0.30 × 200 (east) × 1.0 = 600
    // Floor over vented crawl: cooling fraction 0 → 0; heating 120 × 0.047 × (60 × 0.8) = 270.72 → 271
    // Infiltration: 0.5 × 960 / 60 = 8 CFM; 1.08 × 8 × 20 = 172.8 → 173; latent 0.68 × 8 × 33.807 = 183.91 → 184; heating 518.4 → 518
    // Range allowance: 1,200 Btu/h as entered
    expect(r.sensibleGain).toEqual({
      walls: 116,
      windowsConduction: 32,
      windowsSolar: 600,
      doors: 0,
      ceiling: 0,
      floor: 0,
      infiltration: 173,
      people: 0,
      appliances: 1200,
      total: 2121,
    });
    expect(r.latentGain.total).toBe(184);
    expect(r.heatLoss).toEqual({
      walls: 349,
      windowsConduction: 180,
      windowsSolar: 0,
      doors: 0,
      ceiling: 0,
      floor: 271,
      infiltration: 518,
      people: 0,
      appliances: 0,
      total: 1318,
    });
  });

  it('whole home: sensible 8,594, latent 1,633, cooling 10,227 (0.85 ton), heating 8,944, SHR 0.840', () => {
    const h = homeLoad({ home: threeRoomHome });
    // Sensible 5,300 + 1,173 + 2,121 = 8,594; latent 921 + 528 + 184 = 1,633; cooling 10,227
    // Heating 5,585 + 2,041 + 1,318 = 8,944; SHR 8,594 / 10,227 = 0.8403 → 0.840; tons 10,227 / 12,000 = 0.852 → 0.85
    expect(h.totals).toEqual({
      sensibleBtuh: 8594,
      latentBtuh: 1633,
      coolingBtuh: 10227,
      heatingBtuh: 8944,
      sensibleHeatRatio: 0.84,
      coolingTons: 0.85,
      floorAreaFt2: 564,
    });
    expect(h.sensibleGain.windowsSolar).toBe(2581 + 94 + 600);
    expect(h.psychrometrics.deltaGrains).toBeCloseTo(33.81, 2);
    expect(h.psychrometrics.indoorDewPointF).toBeCloseTo(55.12, 1);
    expect(h.notes.length).toBeGreaterThan(5);
    expect(h.isEstimate).toBe(true);
  });
});
