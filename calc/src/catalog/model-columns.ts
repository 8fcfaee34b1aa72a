import {
  boolCol,
  listCol,
  moneyCol,
  numberCol,
  sellRuleCols,
  readNumberCell,
  textCol,
  tubeCol,
  tubeSizeLabel,
  type CsvColumn,
  type Draft,
  type Rec,
} from './csv-columns';
import { COOLING_TEMPS_F, HEATING_TEMPS_F, LIQUID_SIZES_IN } from './model';

/** The catalog CSV: flat columns; capacity points as one column per rating temperature. */

interface PointLike {
  outdoorF: number;
  btuh: number;
  indoorWbF?: number;
  sensibleBtuh?: number;
}
const pointsOf = (r: Rec, field: string): PointLike[] => {
  const v = r[field];
  return Array.isArray(v) ? (v as PointLike[]) : [];
};
const draftPoints = (d: Draft, field: string): PointLike[] => {
  const v = d[field];
  if (Array.isArray(v)) return v as PointLike[];
  const made: PointLike[] = [];
  d[field] = made;
  return made;
};
const tempTag = (t: number) => (t < 0 ? `minus${-t}f` : `${t}f`);
const ownsPointAt = (field: string, temp: number) => (path: readonly PropertyKey[], draft: Rec) =>
  path[0] === field &&
  (path.length === 1 || (typeof path[1] === 'number' && pointsOf(draft, field)[path[1]]?.outdoorF === temp));

function pointCol(mode: 'cooling' | 'heating', temp: number): CsvColumn {
  const field = mode === 'cooling' ? 'coolingPoints' : 'heatingPoints';
  return {
    name: `${mode}_btuh_${tempTag(temp)}`,
    help: `${mode === 'cooling' ? 'Cooling' : 'Heating'} capacity at ${temp} °F outdoor, Btu/h`,
    read: (r) => {
      const p = pointsOf(r, field).find((x) => x.outdoorF === temp);
      return p ? String(p.btuh) : '';
    },
    write: (d, cell) => {
      const v = readNumberCell(cell);
      if (typeof v === 'string') return v;
      if (v !== undefined) draftPoints(d, field).push({ outdoorF: temp, btuh: v });
      return null;
    },
    owns: (path, draft) => ownsPointAt(field, temp)(path, draft) && path[path.length - 1] !== 'sensibleBtuh',
  };
}

const RATING_F = 95;
const sensibleCol: CsvColumn = {
  name: `cooling_sensible_btuh_${RATING_F}f`,
  help: `Sensible part of the cooling capacity at ${RATING_F} °F outdoor, Btu/h`,
  read: (r) => {
    const p = pointsOf(r, 'coolingPoints').find((x) => x.outdoorF === RATING_F);
    return p?.sensibleBtuh !== undefined ? String(p.sensibleBtuh) : '';
  },
  write: (d, cell) => {
    const v = readNumberCell(cell);
    if (typeof v === 'string') return v;
    if (v === undefined) return null;
    const p = draftPoints(d, 'coolingPoints').find((x) => x.outdoorF === RATING_F);
    if (!p) return `Give cooling_btuh_${RATING_F}f too`;
    p.sensibleBtuh = v;
    return null;
  },
  owns: (path) => path[0] === 'coolingPoints' && path[path.length - 1] === 'sensibleBtuh',
};

const wetBulbCol: CsvColumn = {
  name: 'cooling_indoor_wb_f',
  help: 'Indoor wet bulb the cooling points were rated at, °F (same for every point)',
  read: (r) => {
    const p = pointsOf(r, 'coolingPoints')[0];
    return p?.indoorWbF !== undefined ? String(p.indoorWbF) : '';
  },
  write: (d, cell) => {
    const v = readNumberCell(cell);
    if (typeof v === 'string') return v;
    if (v !== undefined) for (const p of draftPoints(d, 'coolingPoints')) p.indoorWbF = v;
    return null;
  },
  owns: (path) => path[0] === 'coolingPoints' && path[path.length - 1] === 'indoorWbF',
};

function adderCol(liquid: number): CsvColumn {
  const label = tubeSizeLabel(liquid);
  type Adder = { liquidOdIn: number; ozPerFt: number };
  return {
    name: `adder_oz_per_ft_liquid_${label.replace('/', '_')}`,
    help: `Refrigerant to add per ft beyond the pre-charged length with a ${label} in liquid line, oz/ft`,
    read: (r) => {
      const v = r['chargeAdders'];
      const a = Array.isArray(v) ? (v as Adder[]).find((x) => x.liquidOdIn === liquid) : undefined;
      return a ? String(a.ozPerFt) : '';
    },
    write: (d, cell) => {
      const v = readNumberCell(cell);
      if (typeof v === 'string') return v;
      if (v === undefined) return null;
      const list = Array.isArray(d['chargeAdders']) ? (d['chargeAdders'] as Adder[]) : [];
      list.push({ liquidOdIn: liquid, ozPerFt: v });
      d['chargeAdders'] = list;
      return null;
    },
    owns: (path, draft) => {
      if (path[0] !== 'chargeAdders') return false;
      const v = draft['chargeAdders'];
      return typeof path[1] === 'number' && Array.isArray(v) && (v as Adder[])[path[1]]?.liquidOdIn === liquid;
    },
  };
}

/** "9000|12000;9000|12000|18000": ports separated by ";", each port's accepted sizes by "|". */
const portSizesCol: CsvColumn = {
  name: 'port_sizes_btuh',
  help: 'Indoor sizes each port accepts, Btu/h: ports separated by ";", sizes by "|" (e.g. 9000|12000;9000|12000|18000)',
  read: (r) => {
    const v = r['portSizesBtuh'];
    return Array.isArray(v) ? (v as number[][]).map((p) => p.join('|')).join(';') : '';
  },
  write: (d, cell) => {
    const t = cell.trim();
    if (t === '') return null;
    const ports: number[][] = [];
    for (const port of t.split(';')) {
      const sizes: number[] = [];
      for (const s of port.split('|')) {
        const v = readNumberCell(s);
        if (typeof v !== 'number') return 'Write the sizes as numbers: 9000|12000;9000|12000|18000';
        sizes.push(v);
      }
      ports.push(sizes);
    }
    d['portSizesBtuh'] = ports;
    return null;
  },
  owns: (path) => path[0] === 'portSizesBtuh',
};

export const MODEL_COLUMNS: readonly CsvColumn[] = [
  textCol('model', 'key', 'Model number (the key: a row with a known model number updates it)'),
  textCol('description', 'name', 'What the model is'),
  textCol('kind', 'kind', 'outdoor-single-zone, outdoor-multi-zone, outdoor-ducted, indoor or heat-kit'),
  textCol(
    'indoor_type',
    'indoorType',
    'Indoor units: wall, ceiling-cassette, floor-console, slim-ducted or air-handler',
  ),
  boolCol('heat_pump', 'heatPump', 'yes if the unit heats (heat pump), no if cooling only'),
  boolCol('variable_speed', 'variableSpeed', 'yes for an inverter / variable-speed compressor'),
  numberCol('nominal_cooling_btuh', 'nominalCoolingBtuh', 'Nominal cooling capacity, Btu/h'),
  numberCol('nominal_heating_btuh', 'nominalHeatingBtuh', 'Nominal heating capacity at 47 °F, Btu/h'),
  numberCol('min_cooling_btuh', 'minCoolingBtuh', 'Minimum cooling capacity (variable speed), Btu/h'),
  numberCol('max_cooling_btuh', 'maxCoolingBtuh', 'Maximum cooling capacity, Btu/h'),
  numberCol('min_heating_btuh', 'minHeatingBtuh', 'Minimum heating capacity, Btu/h'),
  numberCol('max_heating_btuh', 'maxHeatingBtuh', 'Maximum heating capacity, Btu/h'),
  ...COOLING_TEMPS_F.map((t) => pointCol('cooling', t)),
  sensibleCol,
  wetBulbCol,
  ...HEATING_TEMPS_F.map((t) => pointCol('heating', t)),
  numberCol('sensible_heat_ratio', 'sensibleHeatRatio', 'Sensible heat ratio at rating, 0.5–1'),
  numberCol('seer2', 'seer2', 'SEER2'),
  numberCol('eer2', 'eer2', 'EER2'),
  numberCol('hspf2', 'hspf2', 'HSPF2'),
  textCol('certificate_ref', 'certificateRef', 'Your reference to the efficiency certificate'),
  textCol('refrigerant', 'refrigerant', 'R-410A, R-32 or R-454B'),
  numberCol('factory_charge_oz', 'factoryChargeOz', 'Factory charge, oz'),
  numberCol('precharged_length_ft', 'prechargedLengthFt', 'Line length the factory charge covers, ft'),
  textCol('precharge_basis', 'prechargeBasis', 'per-circuit or system-total'),
  ...LIQUID_SIZES_IN.map(adderCol),
  numberCol('min_line_ft', 'minLineFt', 'Minimum line length per circuit, ft'),
  numberCol('max_line_ft', 'maxLineFt', 'Maximum line length per circuit, ft'),
  numberCol('max_total_line_ft', 'maxTotalLineFt', 'Maximum total line length (multi-zone), ft'),
  numberCol('max_lift_ft', 'maxLiftFt', 'Maximum height between outdoor and indoor, ft'),
  numberCol('max_indoor_height_diff_ft', 'maxIndoorHeightDiffFt', 'Maximum height between indoor units, ft'),
  numberCol('test_pressure_psig', 'testPressurePsig', 'Field pressure test from the nameplate or manual, psig'),
  tubeCol('liquid_in', 'liquidOdIn', 'Liquid connection, in (1/4, 3/8, …)'),
  tubeCol('suction_in', 'suctionOdIn', 'Suction (gas) connection, in'),
  numberCol('ports', 'ports', 'Multi-zone: number of ports'),
  numberCol(
    'connected_min_percent',
    'connectedMinPercent',
    'Multi-zone: least connected indoor capacity, % of nominal',
  ),
  numberCol('connected_max_percent', 'connectedMaxPercent', 'Multi-zone: most connected indoor capacity, % of nominal'),
  portSizesCol,
  listCol('matched_models', 'matchedKeys', 'Models this one pairs with, separated by "|"'),
  numberCol('heat_kit_kw', 'heatKitKw', 'Heat kits: size, kW'),
  boolCol(
    'refrigerant_detection',
    'refrigerantDetection',
    'Indoor units: yes when the maker fits refrigerant detection and mitigation (A2L), else no',
  ),
  numberCol('mca_a', 'mcaA', 'Minimum circuit ampacity, A'),
  numberCol('mocp_a', 'mocpA', 'Maximum overcurrent protection, A'),
  textCol('voltage', 'voltage', '115, 208-230 or 460'),
  numberCol('phase', 'phase', '1 or 3'),
  numberCol('sound_dba', 'soundDba', 'Sound level, dB(A)'),
  numberCol('width_in', 'widthIn', 'Width, in'),
  numberCol('height_in', 'heightIn', 'Height, in'),
  numberCol('depth_in', 'depthIn', 'Depth, in'),
  numberCol('weight_lb', 'weightLb', 'Weight, lb'),
  moneyCol('cost_usd', 'costCents', 'Your cost, dollars'),
  moneyCol('list_usd', 'listCents', 'List price, dollars'),
  textCol('category', 'category', 'Price-book category whose sell rule prices it; empty for the company default'),
  ...sellRuleCols('sell', 'sellRule', 'Overrides the category rule for this model (leave both empty to use it)'),
  boolCol('active', 'active', 'no for a discontinued model (it stays on proposals that used it)'),
];
