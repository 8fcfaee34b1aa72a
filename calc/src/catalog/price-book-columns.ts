import { boolCol, moneyCol, numberCol, sellRuleCols, textCol, tubeCol, type CsvColumn } from './csv-columns';
import { readNumberCell } from './csv-columns';

/** CSV columns of each price-book table. */

export const CATEGORY_COLUMNS: readonly CsvColumn[] = [
  textCol('category', 'key', 'Category key (e.g. line-sets)'),
  textCol('name', 'name', 'Category name'),
  ...sellRuleCols('sell', 'sellRule', 'How items in this category are priced'),
  boolCol('taxable', 'taxable', 'yes if the tax applies to this category'),
];

export const MATERIAL_COLUMNS: readonly CsvColumn[] = [
  textCol('sku', 'key', 'Your SKU (the key)'),
  textCol('description', 'description', 'Description'),
  textCol('unit', 'unit', 'each, ft, lb, roll, box, gal, pair or set'),
  textCol('category', 'category', 'Category key'),
  moneyCol('cost_usd', 'costCents', 'Your cost per unit, dollars'),
  ...sellRuleCols('sell', 'sellRule', 'Overrides the category rule for this item (leave both empty to use it)'),
  textCol(
    'takeoff_item',
    'takeoffItem',
    'The takeoff item this material prices (e.g. wall-sleeve, wire:nm-b:10awg); empty if none',
  ),
  boolCol('active', 'active', 'no to stop offering it'),
];

export const LABOR_COLUMNS: readonly CsvColumn[] = [
  textCol('task', 'key', 'Task key'),
  textCol('description', 'description', 'Description'),
  textCol('unit', 'unit', 'each, ft, circuit, system or hour'),
  numberCol('hours_per_unit', 'hoursPerUnit', 'Hours per unit'),
  moneyCol('rate_usd_per_hour', 'rateCentsPerHour', 'Labor rate (your cost of an hour), dollars'),
  textCol('category', 'category', 'Category key'),
  ...sellRuleCols('sell', 'sellRule', 'Overrides the category rule for this task (leave both empty to use it)'),
  boolCol('active', 'active', 'no to stop using it'),
];

/** "SKU*qty|SKU*qty". */
const componentsCol: CsvColumn = {
  name: 'components',
  help: 'What the kit holds: SKU*quantity separated by "|" (e.g. CU-38*25|NUT-38*2)',
  read: (r) => {
    const v = r['components'];
    return Array.isArray(v)
      ? (v as { sku: string; quantity: number }[]).map((c) => `${c.sku}*${c.quantity}`).join('|')
      : '';
  },
  write: (d, cell) => {
    const t = cell.trim();
    const list: { sku: string; quantity: number }[] = [];
    if (t !== '')
      for (const part of t.split('|')) {
        const [sku = '', qty = ''] = part.split('*');
        const q = readNumberCell(qty);
        if (sku.trim() === '' || typeof q !== 'number') return 'Write components as SKU*quantity|SKU*quantity';
        list.push({ sku: sku.trim(), quantity: q });
      }
    d['components'] = list;
    return null;
  },
  owns: (path) => path[0] === 'components',
};

export const KIT_COLUMNS: readonly CsvColumn[] = [
  textCol('kit', 'key', 'Kit key'),
  textCol('description', 'description', 'Description'),
  textCol('kind', 'kind', 'line-set, install, electrical or condensate'),
  numberCol('length_ft', 'lengthFt', 'Line-set kits: stock length, ft'),
  tubeCol('liquid_in', 'liquidOdIn', 'Line-set kits: liquid tube, in'),
  tubeCol('suction_in', 'suctionOdIn', 'Line-set kits: suction tube, in'),
  componentsCol,
  textCol('category', 'category', 'Category key'),
  moneyCol('cost_usd', 'costCents', 'Your cost of the kit, dollars'),
  ...sellRuleCols('sell', 'sellRule', 'Overrides the category rule for this kit'),
  boolCol('active', 'active', 'no to stop offering it'),
];

export const FINANCING_COLUMNS: readonly CsvColumn[] = [
  textCol('plan', 'key', 'Plan key'),
  textCol('name', 'name', 'Name shown on proposals'),
  numberCol('apr_percent', 'aprPercent', 'Annual percentage rate, %'),
  numberCol('months', 'months', 'Term, months'),
  boolCol('active', 'active', 'no to stop offering it'),
];

export const REFRIGERANT_COLUMNS: readonly CsvColumn[] = [
  textCol('refrigerant', 'key', 'R-410A, R-32 or R-454B'),
  moneyCol('cost_usd_per_lb', 'costCentsPerLb', 'Your cost of one pound, dollars (or fill cost_usd_per_oz instead)'),
  moneyCol(
    'cost_usd_per_oz',
    'costCentsPerOz',
    'Your cost of one ounce, dollars (the charge is then priced by the ounce)',
  ),
  textCol('category', 'category', 'Category key (its sell rule and tax); empty for the company default'),
];

export const DISCOUNT_LIMIT_COLUMNS: readonly CsvColumn[] = [
  textCol('role', 'key', 'owner, estimator, salesperson or installer'),
  numberCol('max_percent', 'maxPercent', 'Largest discount this role may give, % of the sell price'),
];
