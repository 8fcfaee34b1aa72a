import type { EquipmentCatalogInput, HomeInput, PriceBookInput, PricingInput, DesignInput, RoomInput } from '@calc';

/** Invented equipment for tests only (no real makers or models). */
export const catalog: EquipmentCatalogInput = {
  indoorUnits: [
    {
      key: 'GL-9K-WH',
      description: 'GL-9K wall head',
      unitType: 'wall-head',
      nominalBtuh: 9000,
      cooling: [
        { outdoorF: 82, btuh: 9600 },
        { outdoorF: 95, btuh: 9000 },
        { outdoorF: 105, btuh: 8200 },
      ],
      heating: [
        { outdoorF: 5, btuh: 8000 },
        { outdoorF: 47, btuh: 10900 },
      ],
      liquidOdIn: 0.25,
      suctionOdIn: 0.375,
    },
    {
      key: 'GL-12K-WH',
      description: 'GL-12K wall head',
      unitType: 'wall-head',
      nominalBtuh: 12000,
      cooling: [
        { outdoorF: 82, btuh: 12800 },
        { outdoorF: 95, btuh: 12000 },
        { outdoorF: 105, btuh: 11000 },
      ],
      heating: [
        { outdoorF: 5, btuh: 10500 },
        { outdoorF: 47, btuh: 14000 },
      ],
      liquidOdIn: 0.25,
      suctionOdIn: 0.375,
    },
  ],
  outdoorUnits: [
    {
      key: 'GL-O24-M3',
      description: 'GL-O24 three-port outdoor unit',
      equipmentType: 'heat-pump-variable-speed',
      refrigerant: 'R-32',
      nominalBtuh: 24000,
      cooling: [
        { outdoorF: 82, btuh: 25500 },
        { outdoorF: 95, btuh: 24000 },
        { outdoorF: 105, btuh: 22000 },
      ],
      heating: [
        { outdoorF: 5, btuh: 21000 },
        { outdoorF: 47, btuh: 27000 },
      ],
      maxHeads: 3,
      connectedRatioPercent: { min: 50, max: 130 },
      factoryChargeOz: 60,
      prechargedLengthFt: 25,
      adderOzPerFt: 0.16,
      prechargeBasis: 'per-circuit',
      minLineLengthFt: 10,
      maxLineLengthFt: 82,
      maxTotalLineLengthFt: 165,
      maxLiftFt: 49,
      mcaA: 18.6,
      mocpA: 30,
    },
    {
      key: 'GL-O12-S1',
      description: 'GL-O12 single-zone outdoor unit',
      equipmentType: 'heat-pump-variable-speed',
      refrigerant: 'R-410A',
      nominalBtuh: 12000,
      cooling: [{ outdoorF: 95, btuh: 12000 }],
      heating: [
        { outdoorF: 5, btuh: 10000 },
        { outdoorF: 47, btuh: 13500 },
      ],
      factoryChargeOz: 40,
      prechargedLengthFt: 25,
      minLineLengthFt: 10,
      maxLineLengthFt: 65,
      maxLiftFt: 32,
      mcaA: 12,
      mocpA: 15,
    },
  ],
};

/** Design conditions of the worked example: 95/75 °F summer, 10 °F winter, sea level. */
export const conditions = {
  outdoorCoolingDryBulbF: 95,
  outdoorCoolingWetBulbF: 75,
  outdoorHeatingDryBulbF: 10,
  indoorCoolingF: 75,
  indoorHeatingF: 70,
  indoorCoolingRhPercent: 50,
  dailyRangeF: 20,
  elevationFt: 0,
} as const;

export const livingRoom: RoomInput = {
  id: 'living',
  name: 'Living room',
  lengthFt: 20,
  widthFt: 15,
  ceilingHeightFt: 8,
  exposedWalls: [
    {
      direction: 'S',
      lengthFt: 20,
      construction: 'wood-2x4-r13',
      windows: [{ widthIn: 60, heightIn: 48, glazing: 'double-low-e', interiorShading: 'blinds' }],
    },
    {
      direction: 'W',
      lengthFt: 15,
      construction: 'wood-2x4-r13',
      windows: [{ areaFt2: 15, glazing: 'double-clear' }],
      doors: [{ widthIn: 36, heightIn: 80, doorType: 'insulated-steel' }],
    },
  ],
  above: { kind: 'attic', insulation: 'r38' },
  below: { kind: 'slab', edgeInsulated: false },
  occupants: 3,
  appliances: [{ label: 'TV', gain: 150, unit: 'W' }],
};

export const bedroom: RoomInput = {
  id: 'bed',
  name: 'Bedroom',
  lengthFt: 12,
  widthFt: 12,
  ceilingHeightFt: 8,
  exposedWalls: [
    {
      direction: 'N',
      lengthFt: 12,
      windows: [{ widthIn: 36, heightIn: 48, glazing: 'double-low-e', interiorShading: 'drapes' }],
    },
  ],
  above: { kind: 'attic', insulation: 'r38' },
  below: { kind: 'slab' },
  occupants: 2,
};

export const kitchen: RoomInput = {
  id: 'kitchen',
  name: 'Kitchen',
  lengthFt: 10,
  widthFt: 12,
  ceilingHeightFt: 8,
  exposedWalls: [{ direction: 'E', lengthFt: 10, windows: [{ areaFt2: 10, glazing: 'double-low-e' }] }],
  above: { kind: 'conditioned' },
  below: { kind: 'crawlspace', vented: true, insulation: 'r19' },
  appliances: [{ label: 'Range allowance', gain: 1200, unit: 'Btu/h' }],
};

export const threeRoomHome: HomeInput = {
  designConditions: conditions,
  tightness: 'average',
  rooms: [livingRoom, bedroom, kitchen],
};

export const design: DesignInput = {
  zones: [
    { key: 'z-living', name: 'Living', roomIds: ['living', 'kitchen'], indoorUnitKey: 'GL-12K-WH' },
    { key: 'z-bed', name: 'Bedroom', roomIds: ['bed'], indoorUnitKey: 'GL-9K-WH' },
  ],
  systems: [
    {
      key: 's1',
      name: 'Main system',
      outdoorUnitKey: 'GL-O24-M3',
      mounting: 'pad',
      circuits: [
        { zoneKey: 'z-living', lengthFt: 40, liftFt: 5, lineCoverFt: 12, condensateLengthFt: 15 },
        { zoneKey: 'z-bed', lengthFt: 20, liftFt: 9, condensate: 'pump', condensateLengthFt: 8 },
      ],
      electrical: {
        terminationC: 60,
        wiringMethod: 'nm-b',
        circuitLengthFt: 42,
        disconnectDistanceFt: 4,
        disconnectVisible: true,
      },
    },
  ],
};

export const priceBook: PriceBookInput = {
  laborRateCents: 9500,
  items: {
    'equipment:GL-O24-M3': { unitCostCents: 210000 },
    'equipment:GL-12K-WH': { unitCostCents: 52000 },
    'equipment:GL-9K-WH': { unitCostCents: 46000 },
    'line-set-kit:1/4x3/8:50ft': { unitCostCents: 21000 },
    'line-set-kit:1/4x3/8:25ft': { unitCostCents: 13500 },
    'insulation-tape': { unitCostCents: 650 },
    'comm-cable:14-4': { unitCostCents: 95 },
    'wall-sleeve': { unitCostCents: 1200 },
    'line-cover:straight': { unitCostCents: 2400 },
    'line-cover:wall-inlet': { unitCostCents: 1500 },
    'condensate-pump': { unitCostCents: 8900 },
    'condensate-line:3/4': { unitCostCents: 60 },
    'fasteners:kit': { unitCostCents: 900 },
    'mount:pad': { unitCostCents: 4500 },
    'disconnect:60a': { unitCostCents: 2200 },
    'whip:1/2x6ft': { unitCostCents: 1800 },
    'breaker:2p-30a': { unitCostCents: 1400 },
    'wire:nm-b:12awg': { unitCostCents: 110 },
    'refrigerant:R-32': { unitCostCents: 1100 },
    'nitrogen:test': { unitCostCents: 2500 },
  },
};

export const pricing: PricingInput = {
  method: 'margin',
  percent: 40,
  discounts: [{ label: 'Spring offer', kind: 'amount', value: 25000 }],
  taxRatePercent: 6,
  taxOn: 'materials',
  deposit: { kind: 'percent', value: 30 },
  financing: { aprPercent: 9.99, months: 60 },
};
