import { describe, expect, it } from 'vitest';
import { homeLoad, type HomeInput, type RoomInput } from '@calc';
import {
  BED1,
  BED2,
  DEMO_DESIGN_DEFAULTS,
  DUCTED_HOME,
  DUCTED_HOUSE,
  KITCHEN,
  KITCHEN_APPLIANCES,
  LIVING,
  OFFICE,
} from '../../fixtures/demo-homes';

/*
 * The demo homes' kitchen appliances, worked from their source's equations, and the demo homes' figures as a trade
 * reviewer reads them. Source: ANSI/RESNET/ICC 301 reference appliances as NREL's OpenStudio-HPXML implements them
 * (HPXMLtoOpenStudio/resources/hotwater_appliances.rb: refrigerator 637 + 18 × N_br kWh/yr, all sensible; electric
 * range 331 + 39 × N_br kWh/yr, 0.20 lost, sensible (1 − 0.20) × 0.90, latent the rest) and its hourly schedules
 * (resources/data/default_schedules.csv: refrigerator weekday fractions, largest 0.050 at hour 19, July multiplier
 * 1.096; cooking range weekday fractions, largest 0.134 at hour 18), read 5 Dec 2026.
 */
const BTUH_PER_W = 3.412141633; // 1 W = 3.412141633 Btu/h (IT Btu)
const N_BR = 3;

describe('the demo kitchen', () => {
  it('its appliances are the reference appliances in their busiest hour (three bedrooms)', () => {
    const fridgeKwhYear = 637 + 18 * N_BR; // 691
    const fridgeW = (fridgeKwhYear / 365) * 0.05 * 1.096 * 1000; // 103.74 W
    const rangeKwhYear = 331 + 39 * N_BR; // 448
    const rangeHourW = (rangeKwhYear / 365) * 0.134 * 1000; // 164.47 W
    const rangeSensibleW = rangeHourW * (1 - 0.2) * 0.9; // 118.42 W
    const rangeLatentBtuh = rangeHourW * (1 - 0.2 - (1 - 0.2) * 0.9) * BTUH_PER_W; // 44.9 Btu/h
    expect(KITCHEN_APPLIANCES).toEqual([
      { label: 'Refrigerator', gain: Math.round(fridgeW), unit: 'W' },
      { label: 'Range', gain: Math.round(rangeSensibleW), unit: 'W', latentBtuh: Math.round(rangeLatentBtuh) },
    ]);
    expect(KITCHEN.appliances).toBe(KITCHEN_APPLIANCES);
  });

  it('on the loads: (104 + 118) W × 3.412 = 757 Btu/h sensible, above ch. 17’s 464 Btu/h fixed part and under twice it', () => {
    const h = homeLoad({ home: home('k', [LIVING, KITCHEN, BED1], { bedrooms: 2 }) });
    const k = h.rooms.find((r) => r.roomName === 'Kitchen')!;
    expect(k.sensibleGain.appliances).toBe(Math.round((104 + 118) * BTUH_PER_W)); // 757
    // ASHRAE Handbook—Fundamentals 2021 ch. 17 eq. (30): the whole home's fixed internal gain is 464 Btu/h
    expect(k.sensibleGain.appliances).toBeGreaterThan(464);
    expect(k.sensibleGain.appliances).toBeLessThan(2 * 464);
  });
});

const { source: _source, ...conditions } = DEMO_DESIGN_DEFAULTS;
function home(name: string, rooms: RoomInput[], house: Partial<HomeInput>): HomeInput {
  return {
    name,
    designConditions: conditions,
    tightness: 'average',
    rooms: rooms.map((r, i) => ({ ...r, id: `r${i}` })),
    ...house,
  } as HomeInput;
}

describe('the demo homes as a reviewer reads them', () => {
  // The demo jobs' rooms and house facts (fixtures/demo-jobs.ts).
  const homes: [string, HomeInput][] = [
    ['three rooms, 2 bedrooms', home('a', [LIVING, KITCHEN, BED1], { bedrooms: 2 })],
    [
      'five rooms, 3 bedrooms, ERV',
      home('b', [LIVING, KITCHEN, BED1, BED2, OFFICE], {
        bedrooms: 3,
        ventilation: { kind: 'erv-hrv', sensibleEffectiveness: 0.7 },
      }),
    ],
    ['ducted ranch, attic ducts', home('c', DUCTED_HOME, DUCTED_HOUSE as Partial<HomeInput>)],
  ];
  it.each(homes)('%s: block cooling per ft², sun share and SHR in the range homes show', (_label, input) => {
    const h = homeLoad({ home: input });
    const t = h.totals;
    const area = h.rooms.reduce((s, r) => s + r.floorAreaFt2, 0);
    const perFt2 = t.coolingBtuh / area;
    const sun = h.sensibleGain.windowsSolar / t.sensibleBtuh;
    console.log(
      `[demo] ${_label}: ${area} ft², block ${t.coolingBtuh} Btu/h at ${h.block.hour}:00 = ${perFt2.toFixed(1)} Btu/h·ft² ` +
        `(${Math.round(area / (t.coolingBtuh / 12000))} ft²/ton), sun ${(sun * 100).toFixed(1)} % of sensible, SHR ${t.sensibleHeatRatio}` +
        (h.ducts ? `, ducts ${h.ducts.cooling.sensibleBtuh} S + ${h.ducts.cooling.latentBtuh} L Btu/h` : ''),
    );
    // Common practice (a rule of thumb, not a method): homes run roughly 400–1,200 ft² per ton, 10–30 Btu/h·ft²,
    // with a sensible heat ratio of about 0.7–0.95. The kitchen carries no more per ft² than the home's busiest room.
    expect(perFt2).toBeGreaterThan(10);
    expect(perFt2).toBeLessThan(30);
    expect(t.sensibleHeatRatio).toBeGreaterThan(0.7);
    expect(t.sensibleHeatRatio).toBeLessThan(0.95);
    const kitchen = h.rooms.find((r) => /kitchen/i.test(r.roomName))!;
    const perFt2Of = (r: (typeof h.rooms)[number]) => (r.sensibleGain.total + r.latentGain.total) / r.floorAreaFt2;
    expect(perFt2Of(kitchen)).toBeLessThanOrEqual(Math.max(...h.rooms.map(perFt2Of)));
  });
});
