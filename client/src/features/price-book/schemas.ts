import { z } from 'zod';

/** What the company-data API sends; records are checked by calc's table schema where they are used. */
export const dataRowSchema = z.object({
  key: z.string(),
  version: z.number().int(),
  updatedAt: z.string(),
  record: z.record(z.string(), z.unknown()),
});
export type DataRow = z.output<typeof dataRowSchema>;

export const tableResponse = z.object({ dataset: z.string(), rows: z.array(dataRowSchema) });
export const rowResponse = z.object({ row: dataRowSchema });

const cellChange = z.object({ column: z.string(), before: z.string(), after: z.string() });
export type CellChangeView = z.output<typeof cellChange>;

export const historyResponse = z.object({
  history: z.array(
    z.object({
      id: z.string(),
      action: z.enum(['created', 'changed']),
      source: z.enum(['edit', 'import', 'seed']),
      changes: z.array(cellChange),
      changedBy: z.object({ id: z.string(), name: z.string() }).nullable(),
      changedAt: z.string(),
    }),
  ),
});
export type HistoryEntry = z.output<typeof historyResponse>['history'][number];

export const previewSchema = z.object({
  fileErrors: z.array(z.string()),
  counts: z.object({ added: z.number(), changed: z.number(), unchanged: z.number(), refused: z.number() }),
  canApply: z.boolean(),
  notInFile: z.array(z.string()),
  rows: z.array(
    z.object({
      line: z.number(),
      key: z.string().nullable(),
      status: z.enum(['added', 'changed', 'unchanged', 'refused']),
      changes: z.array(cellChange).optional(),
      errors: z.array(z.object({ column: z.string(), message: z.string() })).optional(),
    }),
  ),
});
export type ImportPreview = z.output<typeof previewSchema>;
export const previewResponse = z.object({ preview: previewSchema.extend({ token: z.string() }) });
export const applyResponse = z.object({ applied: previewSchema });
