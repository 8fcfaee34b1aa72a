import { DATASETS, visibleColumns, type CsvColumn, type DataRole, type DatasetId } from '@calc';

/** The columns each table shows in the grid (the side panel shows them all); names are the CSV columns. */
const GRID: Record<DatasetId, readonly string[]> = {
  models: [
    'model',
    'description',
    'kind',
    'indoor_type',
    'nominal_cooling_btuh',
    'seer2',
    'hspf2',
    'refrigerant',
    'cost_usd',
    'list_usd',
    'active',
  ],
  materials: [
    'sku',
    'description',
    'unit',
    'category',
    'takeoff_item',
    'cost_usd',
    'sell_method',
    'sell_percent',
    'active',
  ],
  labor: ['task', 'description', 'unit', 'hours_per_unit', 'rate_usd_per_hour', 'category', 'active'],
  kits: ['kit', 'description', 'kind', 'length_ft', 'liquid_in', 'suction_in', 'cost_usd', 'active'],
  categories: ['category', 'name', 'sell_method', 'sell_percent', 'taxable'],
  financing: ['plan', 'name', 'apr_percent', 'months', 'active'],
  refrigerants: ['refrigerant', 'cost_usd_per_lb'],
  'discount-limits': ['role', 'max_percent'],
};

/** Headings for the grid and the panel: the CSV name made readable ("cost_usd" → "Cost $"). */
export function columnHeading(name: string): string {
  const point = /^(cooling|heating)_btuh_(minus)?(\d+)f$/.exec(name);
  if (point) return `${point[1] === 'cooling' ? 'Cooling' : 'Heating'} at ${point[2] ? '−' : ''}${point[3]} °F, Btu/h`;
  const adder = /^adder_oz_per_ft_liquid_(\d)_(\d)$/.exec(name);
  if (adder) return `Charge adder, ${adder[1]}/${adder[2]} in liquid, oz/ft`;
  const units: Array<[RegExp, string]> = [
    [/_usd_per_lb$/, ' $/lb'],
    [/_usd_per_hour$/, ' $/h'],
    [/_usd$/, ' $'],
    [/_btuh(_95f)?$/, ' Btu/h'],
    [/_percent$/, ' %'],
    [/_in$/, ', in'],
    [/_ft$/, ', ft'],
    [/_oz$/, ', oz'],
    [/_lb$/, ', lb'],
    [/_dba$/, ', dB(A)'],
    [/_kw$/, ', kW'],
    [/_wb_f$/, ' wet bulb, °F'],
    [/^mca_a$/, 'MCA, A'],
    [/^mocp_a$/, 'MOCP, A'],
    [/^seer2$/, 'SEER2'],
    [/^eer2$/, 'EER2'],
    [/^hspf2$/, 'HSPF2'],
  ];
  let out = name;
  for (const [re, to] of units) out = out.replace(re, to);
  return out.replace(/_/g, ' ').replace(/^./, (c) => c.toUpperCase());
}

export function gridColumns(dataset: DatasetId, role: DataRole): CsvColumn[] {
  const visible = visibleColumns(DATASETS[dataset], role);
  return GRID[dataset].flatMap((n) => visible.filter((c) => c.name === n));
}

export const isNumericCell = (s: string) => /^-?\d+(\.\d+)?$/.test(s);

/** The tables a role reads, in the registry's order. */
export function tablesFor(role: DataRole): DatasetId[] {
  return (Object.keys(DATASETS) as DatasetId[]).filter((id) => DATASETS[id].readers.includes(role));
}
