import { DATASETS, hiddenFields, type DataRole, type DatasetId } from '@calc';
import type { CompanyDataChange, CompanyDataRow } from './company-data.entity';

/** A record without the fields the role may not see (cost and sell rules; for installers also prices). */
export function visibleRecord(dataset: DatasetId, role: DataRole, data: Readonly<Record<string, unknown>>) {
  const hidden = new Set(hiddenFields(DATASETS[dataset], role));
  return Object.fromEntries(Object.entries(data).filter(([k]) => !hidden.has(k)));
}

export function presentRow(row: CompanyDataRow, role: DataRole) {
  return {
    key: row.key,
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
    record: visibleRecord(row.dataset, role, row.data),
  };
}

export function presentChange(c: CompanyDataChange) {
  return {
    id: c.id,
    action: c.action,
    source: c.source,
    changes: c.changes,
    changedBy: c.changedBy ? { id: c.changedBy.id, name: c.changedBy.name } : null,
    changedAt: c.changedAt.toISOString(),
  };
}
