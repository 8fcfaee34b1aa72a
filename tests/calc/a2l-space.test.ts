import { describe, it, expect } from 'vitest';
import {
  CalcError,
  computeDesign,
  gFromOz,
  ozFromG,
  m2FromFt2,
  ft2FromM2,
  type DesignInput,
  type EquipmentCatalogInput,
  type HomeInput,
} from '@calc';
import { bedroom, catalog, conditions, kitchen, livingRoom, priceBook, pricing } from './sample-data';

/**
 * Which space the A2L room-size check uses, and with what charge. Every expected number comes from
 * the reference's check rows for IEC 60335-2-40:2018 Annex GG (/work/shared/reference/trade-facts.md
 * §11, rows 11.1–11.4: R-32, LFL 0.307 kg/m³; m_max = 2.5 × LFL^1.25 × h0 × √A, h0 ≥ 0.6 m; m1 = 6 × LFL).
 * The outdoor unit's factory charge covers 25 ft and each circuit is a 25 ft field-cut run, so the
 * system charge is the factory charge exactly (reference §8: extra = max(0, L − L_pre) × adder = 0).
 */

const base = catalog.outdoorUnits[0]!;
const kgToOz = (kg: number) => ozFromG({ g: kg * 1000 });

function catalogWith(chargeKg: number, detection = false): EquipmentCatalogInput {
  return {
    indoorUnits: [
      ...catalog.indoorUnits,
      {
        key: 'GL-12K-DU',
        description: 'GL-12K slim ducted unit',
        unitType: 'ducted-air-handler',
        nominalBtuh: 12000,
        cooling: [{ outdoorF: 95, btuh: 12000 }],
        liquidOdIn: 0.25,
        suctionOdIn: 0.375,
        ...(detection ? { refrigerantDetection: true } : {}),
      },
      {
        key: 'GL-9K-WS',
        description: 'GL-9K wall head with refrigerant detection',
        unitType: 'wall-head',
        nominalBtuh: 9000,
        cooling: [{ outdoorF: 95, btuh: 9000 }],
        liquidOdIn: 0.25,
        suctionOdIn: 0.375,
        refrigerantDetection: true,
      },
    ],
    outdoorUnits: [{ ...base, factoryChargeOz: kgToOz(chargeKg) }],
  };
}

const home = (rooms = [livingRoom, bedroom, kitchen]): HomeInput => ({
  designConditions: conditions,
  tightness: 'average',
  rooms,
});

function designOf(
  zone: Partial<DesignInput['zones'][number]> & { roomIds: string[]; indoorUnitKey: string },
): DesignInput {
  return {
    zones: [{ key: 'z', name: 'Zone', ...zone }],
    systems: [
      {
        key: 's',
        name: 'System',
        outdoorUnitKey: base.key,
        circuits: [{ zoneKey: 'z', lengthFt: 25, lineSet: 'field-cut' }],
        electrical: { circuitLengthFt: 30 },
      },
    ],
  };
}

function a2l(
  chargeKg: number,
  zone: Parameters<typeof designOf>[0],
  opts: { rooms?: HomeInput['rooms']; detection?: boolean } = {},
) {
  const r = computeDesign({
    home: home(opts.rooms),
    design: designOf(zone),
    catalog: catalogWith(chargeKg, opts.detection),
    priceBook,
    pricing,
  });
  const sys = r.systems[0]!;
  return {
    explanation: sys.explanations.find((e) => e.key === 's:a2l:z'),
    m1: sys.explanations.find((e) => e.key === 's:a2l:m1'),
    blockers: r.blockers.filter((b) => b.kind === 'a2l'),
    notes: sys.refrigerant.notes,
    chargeKg: gFromOz({ oz: sys.refrigerant.totalChargeOz }) / 1000,
  };
}

// living 20 × 15 = 300 ft², kitchen 10 × 12 = 120 ft², bedroom 12 × 12 = 144 ft² (sample data)
const livingM2 = m2FromFt2({ ft2: 300 });
const livingKitchenM2 = m2FromFt2({ ft2: 420 });

describe('A2L: a ducted unit counts every room its ducts serve (IEC 60335-2-40:2018 Annex GG, reference §11)', () => {
  it('row 11.2: 2.00 kg at h0 0.6 m needs 34.04 m²; the living room alone (27.9 m²) is short, living + kitchen (39.0 m²) is enough', () => {
    const r = a2l(2, { roomIds: ['living', 'kitchen'], indoorUnitKey: 'GL-12K-DU' });
    // the total is kept to 0.1 oz (2.8 g), so 2 kg comes out 1.9986 kg
    expect(Math.abs(r.chargeKg - 2)).toBeLessThan(0.003);
    // [PUB: reference row 11.2 — R-32, 2.00 kg, h0 0.6 m → A_min 34.04 m² (± 0.05)], A_min ∝ M² for the rounded charge
    expect(Math.abs((r.explanation?.value ?? 0) - 34.04 * (r.chargeKg / 2) ** 2)).toBeLessThanOrEqual(0.05);
    expect(livingM2).toBeLessThan(34.04);
    expect(livingKitchenM2).toBeGreaterThan(34.04);
    expect(r.explanation?.status).toBe('ok');
    expect(r.explanation?.text).toContain('the rooms its ducts serve (Living room, Kitchen)');
    expect(r.blockers).toEqual([]);
    // the same ducted unit serving the living room only is refused, with the space named
    const alone = a2l(2, { roomIds: ['living'], indoorUnitKey: 'GL-12K-DU' });
    expect(alone.blockers).toHaveLength(1);
    expect(alone.blockers[0]?.message).toContain('is 27.9 m²: smaller than the estimated minimum 34 m²');
  });
  it('row 11.1 scaled by h0: the lowest duct opening replaces 0.6 m, and A_min falls as (0.6 / h0)²', () => {
    // [PUB: reference row 11.1 — h0 0.6 m, A 10 m² → m_max 1.084 kg; the formula is linear in h0, so at 7 ft
    // (2.1336 m, SI exact 0.3048 m/ft) 1.084 kg needs 10 × (0.6 / 2.1336)² m²]
    const r = a2l(1.9, { roomIds: ['bed'], indoorUnitKey: 'GL-12K-DU', lowestDuctOpeningFt: 7 });
    const atFloor = a2l(1.9, { roomIds: ['bed'], indoorUnitKey: 'GL-12K-DU' });
    const ratio = (r.explanation?.value ?? 0) / (atFloor.explanation?.value ?? 1);
    expect(ratio).toBeCloseTo((0.6 / 2.1336) ** 2, 2);
    // 1.9 kg at 0.6 m: A_min = 10 × (1.9 / 1.084)² ≈ 30.7 m² > bedroom 13.4 m² → refused; at 7 ft ≈ 2.4 m² → fits
    expect(Math.abs((atFloor.explanation?.value ?? 0) - 10 * (1.9 / 1.084) ** 2)).toBeLessThanOrEqual(0.1);
    expect(atFloor.blockers).toHaveLength(1);
    expect(r.blockers).toEqual([]);
    expect(r.explanation?.text).toContain('(the lowest duct opening)');
  });
});

describe('A2L: a ductless head counts the room it is in, unless the zone is one open space (reference §11)', () => {
  // A bedroom of exactly 15 m² (12 ft × 13.45489 ft) for row 11.3
  const bed15 = { ...bedroom, widthFt: ft2FromM2({ m2: 15 }) / 12 };
  it('row 11.3: a wall head (h0 1.8 m) in a 15 m² room takes up to 3.98 kg', () => {
    // [PUB: reference row 11.3 — R-32, h0 1.8 m, A 15 m² → m_max 3.98 kg]
    const under = a2l(3.95, { roomIds: ['bed'], indoorUnitKey: 'GL-9K-WH' }, { rooms: [livingRoom, bed15, kitchen] });
    const over = a2l(4.02, { roomIds: ['bed'], indoorUnitKey: 'GL-9K-WH' }, { rooms: [livingRoom, bed15, kitchen] });
    expect(under.blockers).toEqual([]);
    expect(over.blockers).toHaveLength(1);
  });
  it('the head room is the one named, not the zone total: a head in the bedroom of a bedroom + living zone', () => {
    // 4.02 kg needs just over 15 m² at 1.8 m (row 11.3); bedroom 15 m² alone is short, bedroom + living is not
    const zone = { roomIds: ['living', 'bed'], indoorUnitKey: 'GL-9K-WH', headRoomId: 'bed' };
    const r = a2l(4.02, zone, { rooms: [livingRoom, bed15, kitchen] });
    expect(r.blockers).toHaveLength(1);
    expect(r.explanation?.text).toContain('the room the indoor unit is in (Bedroom): 15 m²');
    // the same zone said to be one open space counts both rooms
    const open = a2l(4.02, { ...zone, openSpace: true }, { rooms: [livingRoom, bed15, kitchen] });
    expect(open.blockers).toEqual([]);
    expect(open.explanation?.text).toContain("the zone's rooms, one open space (Living room, Bedroom)");
  });
  it('a head room outside the zone is refused with its field path', () => {
    try {
      a2l(4, { roomIds: ['living'], indoorUnitKey: 'GL-9K-WH', headRoomId: 'bed' });
      expect.unreachable('a head room outside the zone must be refused');
    } catch (e) {
      expect(e).toBeInstanceOf(CalcError);
      expect((e as CalcError).details[0]?.path).toEqual(['zones', 0, 'headRoomId']);
    }
  });
});

describe('A2L: below m1 no room area applies (reference row 11.4)', () => {
  it('m1 = 6 × 0.307 = 1.842 kg: 1.80 kg in a 13 m² bedroom with a ducted unit at 0.6 m is not checked; 1.86 kg is', () => {
    // [PUB: reference row 11.4 — R-32 m1 = 6 × LFL = 1.842 kg]
    const below = a2l(1.8, { roomIds: ['bed'], indoorUnitKey: 'GL-12K-DU' });
    expect(below.m1?.status).toBe('ok');
    expect(below.explanation).toBeUndefined();
    const above = a2l(1.86, { roomIds: ['bed'], indoorUnitKey: 'GL-12K-DU' });
    expect(above.m1).toBeUndefined();
    expect(above.explanation?.status).toBe('blocker');
  });
});

describe("A2L: the maker's refrigerant detection replaces the room-area limit by the m2 ceiling", () => {
  it('6 kg through a wall head with detection in a 13.4 m² bedroom passes, with the mitigation note; above 52 × LFL it is refused', () => {
    // Without detection, 6 kg at h0 1.8 m needs 15 × (6 / 3.98)² ≈ 34 m² (row 11.3, A ∝ m²): the bedroom is short.
    const plain = a2l(6, { roomIds: ['bed'], indoorUnitKey: 'GL-9K-WH' });
    expect(plain.blockers).toHaveLength(1);
    const sensed = a2l(6, { roomIds: ['bed'], indoorUnitKey: 'GL-9K-WS' });
    expect(sensed.blockers).toEqual([]);
    expect(sensed.explanation?.text).toContain('m2 = 52 m³ × 0.307 kg/m³ = 15.96 kg');
    expect(sensed.notes.some((n) => n.includes('install and wire it as the maker instructs'))).toBe(true);
    // m2 = 52 m³ × LFL [MEM: the reference marks the multiplier "from memory"]: 52 × 0.307 = 15.964 kg
    const tooMuch = a2l(16.1, { roomIds: ['bed'], indoorUnitKey: 'GL-9K-WS' });
    expect(tooMuch.blockers).toHaveLength(1);
    expect(tooMuch.blockers[0]?.message).toContain('above the 15.96 kg ceiling');
  });
});
