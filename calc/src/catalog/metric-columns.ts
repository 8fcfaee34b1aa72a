import { centsToDollars, dollarsToCents, readNumberCell, type CsvColumn } from './csv-columns';

/**
 * Metric variants of the catalog and price-book CSV columns that carry a unit, for a company
 * that uses metric. Records stay imperial (the canonical units); a metric column wraps the
 * imperial one and converts the cell on the way in and out, with the exact definitions:
 * 1 ft = 0.3048 m, 1 in = 25.4 mm, 1 lb = 0.45359237 kg, 1 oz = 1/16 lb = 28.349523125 g
 * [PUB: international yard and pound, 1959; NIST SP 811 appendix B]. Capacities stay in
 * Btu/h at the °F rating temperatures the columns name, and tube sizes stay in nominal
 * inches: those are how the equipment is rated and the tube is sold.
 */
export const M_PER_FT = 0.3048;
export const MM_PER_IN = 25.4;
export const KG_PER_LB = 0.45359237;
export const G_PER_OZ = 28.349523125;

/** Decimals kept on the imperial value read from a metric cell (finer than any metric cell's step). */
const IMPERIAL_DECIMALS = 5;

const round = (v: number, decimals: number): number => {
  const f = 10 ** decimals;
  return Math.round(v * f) / f;
};

interface NumberVariant {
  readonly name: string;
  readonly help: string;
  /** Metric value per imperial unit (e.g. 0.3048 m per ft). */
  readonly factor: number;
  /** Decimals written to the metric cell (the column's precision). */
  readonly decimals: number;
}

function numberVariant(imperial: CsvColumn, v: NumberVariant): CsvColumn {
  return {
    name: v.name,
    help: v.help,
    read: (r) => {
      const cell = imperial.read(r);
      return cell === '' ? '' : String(round(Number(cell) * v.factor, v.decimals));
    },
    write: (d, cell) => {
      const n = readNumberCell(cell);
      if (typeof n === 'string') return n;
      if (n === undefined) return imperial.write(d, '');
      return imperial.write(d, String(round(n / v.factor, IMPERIAL_DECIMALS)));
    },
    owns: imperial.owns,
  };
}

/** Dollars per kg ↔ the stored cents per lb (whole cents, so a per-kg price resolves to about 2 cents). */
/** A cost per imperial mass unit shown per metric unit; `perImperial` = metric units in one imperial unit (kg per lb). */
function moneyPerKgVariant(imperial: CsvColumn, name: string, help: string, perImperial = KG_PER_LB): CsvColumn {
  return {
    name,
    help,
    read: (r) => {
      const cell = imperial.read(r);
      if (cell === '') return '';
      const centsPerLb = dollarsToCents(cell);
      return typeof centsPerLb === 'number' ? centsToDollars(Math.round(centsPerLb / perImperial)) : '';
    },
    write: (d, cell) => {
      const centsPerKg = dollarsToCents(cell);
      if (typeof centsPerKg === 'string') return centsPerKg;
      if (centsPerKg === undefined) return imperial.write(d, '');
      return imperial.write(d, centsToDollars(Math.round(centsPerKg * perImperial)));
    },
    owns: imperial.owns,
  };
}

const LENGTH = (name: string, what: string): NumberVariant => ({
  name,
  help: `${what}, m`,
  factor: M_PER_FT,
  decimals: 3,
});
const DIMENSION = (name: string, what: string): NumberVariant => ({
  name,
  help: `${what}, mm`,
  factor: MM_PER_IN,
  decimals: 0,
});

/** Imperial column name → its metric variant. */
const NUMBER_VARIANTS: Readonly<Record<string, NumberVariant>> = {
  factory_charge_oz: { name: 'factory_charge_g', help: 'Factory charge, g', factor: G_PER_OZ, decimals: 0 },
  precharged_length_ft: LENGTH('precharged_length_m', 'Line length the factory charge covers'),
  min_line_ft: LENGTH('min_line_m', 'Minimum line length per circuit'),
  max_line_ft: LENGTH('max_line_m', 'Maximum line length per circuit'),
  max_total_line_ft: LENGTH('max_total_line_m', 'Maximum total line length (multi-zone)'),
  max_lift_ft: LENGTH('max_lift_m', 'Maximum height between outdoor and indoor'),
  max_indoor_height_diff_ft: LENGTH('max_indoor_height_diff_m', 'Maximum height between indoor units'),
  length_ft: LENGTH('length_m', 'Line-set kits: stock length'),
  width_in: DIMENSION('width_mm', 'Width'),
  height_in: DIMENSION('height_mm', 'Height'),
  depth_in: DIMENSION('depth_mm', 'Depth'),
  weight_lb: { name: 'weight_kg', help: 'Weight, kg', factor: KG_PER_LB, decimals: 2 },
};

const ADDER = /^adder_oz_per_ft_liquid_(.+)$/;

/** The metric variant of a column, or null when the column carries no unit that changes. */
export function metricVariant(column: CsvColumn): CsvColumn | null {
  const v = NUMBER_VARIANTS[column.name];
  if (v) return numberVariant(column, v);
  const adder = ADDER.exec(column.name);
  if (adder)
    return numberVariant(column, {
      name: `adder_g_per_m_liquid_${adder[1] ?? ''}`,
      help: column.help.replace('per ft', 'per m').replace(/oz\/ft$/, 'g/m'),
      factor: G_PER_OZ / M_PER_FT,
      decimals: 2,
    });
  if (column.name === 'cost_usd_per_lb')
    return moneyPerKgVariant(column, 'cost_usd_per_kg', 'Your cost of one kilogram, dollars');
  if (column.name === 'cost_usd_per_oz')
    return moneyPerKgVariant(column, 'cost_usd_per_100g', 'Your cost of 100 grams, dollars', G_PER_OZ / 100);
  return null;
}

export type CsvUnitSystem = 'imperial' | 'metric';

/** The columns a file is written with for a company: metric variants replace imperial ones for a metric company. */
export function columnsForUnits(columns: readonly CsvColumn[], units: CsvUnitSystem): CsvColumn[] {
  return columns.map((c) => (units === 'metric' ? (metricVariant(c) ?? c) : c));
}
