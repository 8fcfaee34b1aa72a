import type { DatasetId } from '@calc';

export const priceBookKeys = {
  all: ['price-book'] as const,
  table: (dataset: DatasetId) => [...priceBookKeys.all, 'table', dataset] as const,
  history: (dataset: DatasetId, key: string) => [...priceBookKeys.all, 'history', dataset, key] as const,
};
