import type { ZodType } from 'zod';
import type { CsvColumn } from './csv-columns';
import { catalogModelSchema } from './model';
import { MODEL_COLUMNS } from './model-columns';
import {
  categorySchema,
  discountLimitSchema,
  financingPlanSchema,
  kitSchema,
  laborTaskSchema,
  materialSchema,
  refrigerantCostSchema,
} from './price-book';
import {
  CATEGORY_COLUMNS,
  DISCOUNT_LIMIT_COLUMNS,
  FINANCING_COLUMNS,
  KIT_COLUMNS,
  LABOR_COLUMNS,
  MATERIAL_COLUMNS,
  REFRIGERANT_COLUMNS,
} from './price-book-columns';

/**
 * The company's data, table by table: the catalog and each price-book table. One registry
 * so the server's routes, the import and export, the history and the screens treat every
 * table the same way. Each record has a string `key`, unique within its company and table.
 */
export const DATASET_IDS = [
  'models',
  'materials',
  'labor',
  'kits',
  'categories',
  'financing',
  'refrigerants',
  'discount-limits',
] as const;
export type DatasetId = (typeof DATASET_IDS)[number];

export type DataRole = 'owner' | 'estimator' | 'salesperson' | 'installer';

export interface Dataset {
  readonly id: DatasetId;
  readonly label: string;
  /** One row, e.g. "model"; used in messages. */
  readonly noun: string;
  readonly schema: ZodType<{ key: string }>;
  readonly columns: readonly CsvColumn[];
  /** Who may read it (owner and estimator always edit). */
  readonly readers: readonly DataRole[];
  /** Fields of the record that are the company's cost or its pricing rule (hidden from salespeople and installers). */
  readonly costFields: readonly string[];
  /** Fields that are a price to the customer (hidden from installers). */
  readonly priceFields: readonly string[];
}

const ALL: readonly DataRole[] = ['owner', 'estimator', 'salesperson', 'installer'];
const SELLERS: readonly DataRole[] = ['owner', 'estimator', 'salesperson'];
const OFFICE: readonly DataRole[] = ['owner', 'estimator'];
export const EDITORS: readonly DataRole[] = OFFICE;

export const DATASETS: Readonly<Record<DatasetId, Dataset>> = {
  models: {
    id: 'models',
    label: 'Equipment catalog',
    noun: 'model',
    schema: catalogModelSchema,
    columns: MODEL_COLUMNS,
    readers: ALL,
    costFields: ['costCents', 'sellRule'],
    priceFields: ['listCents'],
  },
  materials: {
    id: 'materials',
    label: 'Materials',
    noun: 'material',
    schema: materialSchema,
    columns: MATERIAL_COLUMNS,
    readers: ALL,
    costFields: ['costCents', 'sellRule'],
    priceFields: [],
  },
  labor: {
    id: 'labor',
    label: 'Labor tasks',
    noun: 'labor task',
    schema: laborTaskSchema,
    columns: LABOR_COLUMNS,
    readers: ALL,
    costFields: ['rateCentsPerHour', 'sellRule'],
    priceFields: [],
  },
  kits: {
    id: 'kits',
    label: 'Kits',
    noun: 'kit',
    schema: kitSchema,
    columns: KIT_COLUMNS,
    readers: ALL,
    costFields: ['costCents', 'sellRule'],
    priceFields: [],
  },
  categories: {
    id: 'categories',
    label: 'Categories and sell rules',
    noun: 'category',
    schema: categorySchema,
    columns: CATEGORY_COLUMNS,
    readers: SELLERS,
    costFields: ['sellRule'],
    priceFields: [],
  },
  financing: {
    id: 'financing',
    label: 'Financing plans',
    noun: 'financing plan',
    schema: financingPlanSchema,
    columns: FINANCING_COLUMNS,
    readers: SELLERS,
    costFields: [],
    priceFields: [],
  },
  refrigerants: {
    id: 'refrigerants',
    label: 'Refrigerant cost',
    noun: 'refrigerant',
    schema: refrigerantCostSchema,
    columns: REFRIGERANT_COLUMNS,
    readers: OFFICE,
    costFields: ['costCentsPerLb', 'costCentsPerOz'],
    priceFields: [],
  },
  'discount-limits': {
    id: 'discount-limits',
    label: 'Discount limits',
    noun: 'discount limit',
    schema: discountLimitSchema,
    columns: DISCOUNT_LIMIT_COLUMNS,
    readers: SELLERS,
    costFields: [],
    priceFields: [],
  },
};

export const isDatasetId = (v: string): v is DatasetId => (DATASET_IDS as readonly string[]).includes(v);

/** The fields a role may not see in a dataset's records. */
export function hiddenFields(dataset: Dataset, role: DataRole): readonly string[] {
  if (role === 'owner' || role === 'estimator') return [];
  if (role === 'salesperson') return dataset.costFields;
  return [...dataset.costFields, ...dataset.priceFields];
}

/** The CSV columns a role may see (a column is hidden when the field it writes is). */
export function visibleColumns(dataset: Dataset, role: DataRole): readonly CsvColumn[] {
  const hidden = hiddenFields(dataset, role);
  return dataset.columns.filter((c) => !hidden.some((f) => c.owns([f], {})));
}
