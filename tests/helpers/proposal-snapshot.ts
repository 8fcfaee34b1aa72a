import type { ProposalSnapshot } from '@contract';
import { CAUTIONS } from '@calc';

const model = (
  key: string,
  name: string,
  kind: string,
  c: number | null,
  h: number | null,
  seer2: number | null,
  eer2: number | null,
  hspf2: number | null,
) => ({ key, name, kind, nominalCoolingBtuh: c, nominalHeatingBtuh: h, seer2, eer2, hspf2 });

const system = (n: number) => ({
  key: `sys-${n}`,
  name: `Heat pump ${n}`,
  outdoor: model(`FX-30H${n}`, 'Tessaline 30k multi-zone heat pump', 'multi-zone', 30000, 32000, 20.5, 12.1, 9.6),
  zones: [
    {
      key: 'z1',
      name: 'Great room',
      rooms: ['Great room', 'Kitchen'],
      indoor: model('FW-12W', 'Tessaline 12k wall head', 'wall', 12000, 13500, null, null, null),
      coolingLoadBtuh: 11250,
      heatingLoadBtuh: 12980,
    },
    {
      key: 'z2',
      name: 'Primary bedroom',
      rooms: ['Primary bedroom'],
      indoor: model('FW-09W', 'Tessaline 9k wall head', 'wall', 9000, 10900, null, null, null),
      coolingLoadBtuh: 6100,
      heatingLoadBtuh: 7350,
    },
  ],
  refrigerant: 'R-454B',
  lineSets: [
    {
      zoneKey: 'z1',
      zoneName: 'Great room',
      liquid: '1/4',
      suction: '1/2',
      lengthFt: 35,
      installedLengthFt: 35,
      kind: 'field-cut' as const,
      extraChargeOz: 2.2,
      liftFt: 8,
      extraChargeText: '35 ft installed − 25 ft pre-charged = 10 ft × 0.22 oz/ft = 2.2 oz',
      condensate: { kind: 'gravity' as const, lengthFt: 10 },
    },
    {
      zoneKey: 'z2',
      zoneName: 'Primary bedroom',
      liquid: '1/4',
      suction: '3/8',
      lengthFt: 20,
      installedLengthFt: 25,
      kind: 'kit' as const,
      extraChargeOz: 0,
      liftFt: 0,
      extraChargeText:
        '25 ft installed (20 ft run + 5 ft of the 25 ft kit coiled) ≤ 25 ft pre-charged: nothing to add (no charge is removed for a short run) = 0.0 oz',
      condensate: { kind: 'pump' as const, lengthFt: 20 },
    },
  ],
  extraChargeOz: 2.2,
  totalChargeOz: 88.2,
  electrical: {
    supplyVoltage: 240,
    mcaA: 25,
    mocpA: 40,
    breakerA: 40,
    wireAwg: 10,
    circuitLengthFt: 45,
    disconnectA: 60,
  },
  heatKit: n === 3 ? model('HK-05', 'Tessaline 5 kW heat kit', 'heat-kit', null, 17060, null, null, null) : null,
});

const option = (position: number, name: string, total: number) => ({
  position,
  name,
  systems: [system(position)],
  included: [
    'Outdoor heat pump on a composite pad with riser feet',
    'Two wall heads with line-set covers outside',
    'Refrigerant lines, insulation and wall sleeves',
    'Disconnect, whip and circuit wiring',
    'Condensate drains and pump',
    'Start-up, nitrogen pressure test and deep evacuation',
    'Haul-away of packaging',
    'Permit and inspection',
  ],
  takeoff: [],
  price: {
    sellCents: total - 50000,
    discountCents: position === 2 ? 25000 : 0,
    subtotalCents: total - 50000 - (position === 2 ? 25000 : 0),
    taxCents: 41234,
    totalCents: total,
    depositCents: Math.round(total * 0.1),
    balanceCents: total - Math.round(total * 0.1),
  },
  monthly:
    position === 1
      ? []
      : [
          { name: 'Twelve-year plan', aprPercent: 7.99, months: 144, monthlyPaymentCents: 14012 },
          { name: 'Five-year plan', aprPercent: 0, months: 60, monthlyPaymentCents: 24210 },
        ],
});

/**
 * A three-option proposal snapshot of invented equipment and figures (the contract's shape, as issuing
 * stores it), for the PDF's tests and `npm run bench`. Prices differ per option so each can be found in the text.
 */
export const sampleSnapshot = (customerName: string): ProposalSnapshot => ({
  schema: 1,
  company: {
    name: 'Alder Bay Comfort Co.',
    address: '4410 Tidewater Lane, Alder Bay, OR 97000',
    phone: '(555) 010-4410',
    email: 'office@alderbay-comfort.example',
    licence: 'CCB #000000 (demo)',
    logoKey: null,
    terms:
      'Prices hold for 30 days from the issue date.\n\nWork begins within three weeks of signing, weather permitting. The balance is due on completion.\r\nPermits are included.',
    warranty: 'Labor: two years from start-up.\nEquipment: the maker’s warranty, registered by us within 60 days.',
    cancellationExtra: '',
  },
  customer: { name: customerName, email: 'pat@example.com', phone: '555-0100' },
  site: { street: '18 Larkspur Court', unit: '', city: 'Alder Bay', region: 'OR', postalCode: '97000' },
  design: {
    conditions: {
      outdoorCoolingDryBulbF: 91,
      outdoorCoolingWetBulbF: 67,
      outdoorHeatingDryBulbF: 23,
      indoorCoolingF: 75,
      indoorHeatingF: 70,
      indoorCoolingRhPercent: 50,
      dailyRangeF: 22,
      elevationFt: 150,
      latitudeDeg: 45.5,
    },
    sources: {
      source: 'ASHRAE 2021 climatic design data, nearest station (99.6 % heating, 1 % cooling)',
      outdoorCoolingDryBulbF: { source: 'company-default', note: '' },
      indoorCoolingF: { source: 'entered', note: 'Homeowner’s preference' },
    },
    method:
      'Each room’s heat gain was worked out hour by hour through a hot design day, and its heat loss at the cold design temperature, following the ASHRAE Handbook—Fundamentals; the whole-home figure is the hour when all rooms together need the most cooling.',
  },
  loads: {
    rooms: ['Great room', 'Kitchen', 'Primary bedroom', 'Bedroom 2', 'Bedroom 3', 'Office', 'Bath'].map((name, i) => ({
      roomId: `r${i}`,
      name,
      floorAreaFt2: 120 + i * 20,
      sensibleBtuh: 2800 + i * 310,
      latentBtuh: 300 + i * 20,
      coolingBtuh: 3100 + i * 330,
      heatingBtuh: 3600 + i * 200,
    })),
    block: {
      hour: 16,
      sensibleBtuh: 22150,
      latentBtuh: 2150,
      coolingBtuh: 24300,
      heatingBtuh: 29400,
      floorAreaFt2: 1260,
    },
  },
  options: [option(1, 'Good', 1234500), option(2, 'Better', 1598000), option(3, 'Best', 2123456)],
  cautions: Object.values(CAUTIONS),
  calcVersion: '0.1.0',
  issuedAt: '2026-12-05T06:30:00.000Z',
});
