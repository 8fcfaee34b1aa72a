import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { diffSnapshots, proposalSnapshot, type ProposalSnapshot } from '@contract';

/** "What changed" between two versions (contract/proposal-diff.ts): pure, checked on made-up snapshots. */
const model = (key: string, name: string) => ({
  key,
  name,
  kind: 'outdoor-single',
  nominalCoolingBtuh: 12000,
  nominalHeatingBtuh: 13000,
  seer2: 20,
  eer2: 11,
  hspf2: 9,
});
const base: ProposalSnapshot = proposalSnapshot.parse({
  schema: 1,
  company: {
    name: 'Quillfeather Comfort',
    address: null,
    phone: null,
    email: null,
    licence: null,
    logoKey: null,
    terms: 'Net 30.',
    warranty: 'One year labor.',
    cancellationExtra: '',
  },
  customer: { name: 'Orla Pimbleby', email: 'orla@example.com', phone: null },
  site: { street: '12 Juniper Row', unit: '', city: 'Fernhollow', region: 'OR', postalCode: '97000' },
  design: { conditions: { outdoorSummerDb: 95 }, sources: {}, method: 'An estimate.' },
  loads: {
    rooms: [
      {
        roomId: 'r1',
        name: 'Living room',
        floorAreaFt2: 300,
        sensibleBtuh: 5000,
        latentBtuh: 400,
        coolingBtuh: 5400,
        heatingBtuh: 7000,
      },
      {
        roomId: 'r2',
        name: 'Office',
        floorAreaFt2: 120,
        sensibleBtuh: 2000,
        latentBtuh: 100,
        coolingBtuh: 2100,
        heatingBtuh: 3000,
      },
    ],
    block: { hour: 16, sensibleBtuh: 6800, latentBtuh: 500, coolingBtuh: 7300, heatingBtuh: 10000, floorAreaFt2: 420 },
  },
  options: [
    {
      position: 1,
      name: 'Essential',
      systems: [
        {
          key: 's1',
          name: 'Living system',
          outdoor: model('OUT-12', 'Outdoor 12k'),
          zones: [
            {
              key: 'z1',
              name: 'Living',
              rooms: ['Living room'],
              indoor: model('IN-12', 'Wall head 12k'),
              coolingLoadBtuh: 5400,
              heatingLoadBtuh: 7000,
            },
          ],
          refrigerant: 'R-454B',
          lineSets: [
            {
              zoneKey: 'z1',
              zoneName: 'Living',
              liquid: '1/4"',
              suction: '3/8"',
              lengthFt: 30,
              installedLengthFt: 30,
              kind: 'field-cut',
              extraChargeOz: 3,
              liftFt: 8,
              extraChargeText: '30 ft installed − 25 ft pre-charged = 5 ft × 0.6 oz/ft = 3 oz',
              condensate: { kind: 'gravity', lengthFt: 10 },
            },
          ],
          extraChargeOz: 3,
          totalChargeOz: 40,
          electrical: {
            supplyVoltage: 240,
            mcaA: 12,
            mocpA: 20,
            breakerA: 20,
            wireAwg: 12,
            circuitLengthFt: 40,
            disconnectA: 60,
          },
          heatKit: null,
        },
      ],
      included: ['Outdoor 12k', 'Wall head 12k', 'Install labor'],
      takeoff: [
        {
          itemKey: 'OUT-12',
          description: 'Outdoor 12k',
          quantity: 1,
          unit: 'each',
          category: 'equipment',
          sellCents: 250000,
        },
        {
          itemKey: 'LS-14-38',
          description: 'Line set 1/4 × 3/8',
          quantity: 30,
          unit: 'ft',
          category: 'material',
          sellCents: 36000,
        },
      ],
      price: {
        sellCents: 500000,
        discountCents: 0,
        subtotalCents: 500000,
        taxCents: 10000,
        totalCents: 510000,
        depositCents: 51000,
        balanceCents: 459000,
      },
      monthly: [{ name: '60 months', aprPercent: 7.99, months: 60, monthlyPaymentCents: 10338 }],
    },
  ],
  cautions: ['Follow the maker’s instructions.'],
  calcVersion: '0.1.0',
  issuedAt: '2026-12-05T07:00:00.000Z',
});

/** The identities lists are matched by: changing one is a record removed and another added, not a changed value. */
const IDENTITY_KEYS = new Set(['roomId', 'position', 'key', 'zoneKey', 'itemKey', 'schema']);

type Leaf = { path: (string | number)[]; value: unknown };
/** Every changeable leaf of an object (string lists, whose items are compared as words, are left to their own test). */
function leaves(v: unknown, path: (string | number)[] = []): Leaf[] {
  if (Array.isArray(v))
    return v.every((x) => typeof x === 'object' && x !== null) ? v.flatMap((x, i) => leaves(x, [...path, i])) : [];
  if (typeof v === 'object' && v !== null)
    return Object.entries(v).flatMap(([k, x]) =>
      IDENTITY_KEYS.has(k) && !(typeof x === 'object' && x !== null) ? [] : leaves(x, [...path, k]),
    );
  return path[0] === 'issuedAt' || (typeof path.at(-1) === 'string' && IDENTITY_KEYS.has(path.at(-1) as string))
    ? []
    : [{ path, value: v }];
}
const changedValue = (v: unknown): unknown =>
  typeof v === 'number' ? v + 7 : typeof v === 'string' ? `${v}~` : v === null ? 1 : !v;
function setAt(obj: unknown, path: (string | number)[], value: unknown): void {
  let o = obj as Record<string | number, unknown>;
  for (const p of path.slice(0, -1)) o = o[p] as Record<string | number, unknown>;
  o[path.at(-1)!] = value;
}
// A monthly plan is matched by its name.
const ALL = leaves(base).filter((l) => !(l.path.at(-3) === 'monthly' && l.path.at(-1) === 'name'));

describe('diffSnapshots', () => {
  it('finds nothing between a snapshot and itself, nor when only the issue time differs', () => {
    expect(diffSnapshots(base, base)).toEqual([]);
    expect(diffSnapshots(base, { ...base, issuedAt: '2027-01-01T00:00:00.000Z' })).toEqual([]);
  });

  it('reports every changed value exactly once, whichever values change (property)', () => {
    expect(ALL.length).toBeGreaterThan(60);
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.integer({ min: 0, max: ALL.length - 1 }), { minLength: 1, maxLength: 12 }),
        (picked) => {
          const b = structuredClone(base);
          for (const i of picked) setAt(b, ALL[i]!.path, changedValue(ALL[i]!.value));
          const changes = diffSnapshots(base, b);
          expect(changes).toHaveLength(picked.length);
          expect(new Set(changes.map((c) => c.path)).size).toBe(picked.length);
          expect(diffSnapshots(b, b)).toEqual([]);
          // Back the other way: the same number of sentences.
          expect(diffSnapshots(b, base)).toHaveLength(picked.length);
        },
      ),
    );
  });

  it('says what changed in plain sentences, by area', () => {
    const b = structuredClone(base);
    b.options[0]!.price.totalCents = 525000;
    b.options[0]!.systems[0]!.lineSets[0]!.lengthFt = 45;
    b.loads.rooms.push({
      roomId: 'r3',
      name: 'Den',
      floorAreaFt2: 100,
      sensibleBtuh: 1,
      latentBtuh: 1,
      coolingBtuh: 2,
      heatingBtuh: 3,
    });
    b.options[0]!.takeoff = b.options[0]!.takeoff.filter((l) => l.itemKey !== 'LS-14-38');
    b.company.terms = 'Net 15.';
    b.options[0]!.included.push('Condensate pump');
    const changes = diffSnapshots(base, b);
    expect(changes.map((c) => [c.area, c.sentence])).toEqual(
      expect.arrayContaining([
        ['prices', 'Option “Essential” · price: total $5,100.00 → $5,250.00.'],
        ['line sets', 'Option “Essential” · system “Living system” · line set “Living”: run (ft) 30 → 45.'],
        ['rooms', 'Loads: room “Den” added.'],
        ['takeoff', 'Option “Essential”: takeoff line “Line set 1/4 × 3/8” removed.'],
        ['terms', 'Company: terms “Net 30.” → “Net 15.”.'],
        ['options', 'Option “Essential”: included: “Condensate pump” added.'],
      ]),
    );
    expect(changes).toHaveLength(6);
  });
});
