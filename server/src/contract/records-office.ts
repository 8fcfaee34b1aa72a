import { z } from 'zod';
import { TIGHTNESS } from './enums';
import { personRef, recordId as id, recordTimestamp as timestamp } from './records';

/**
 * Response schemas of the office's pages (the loads page, the catalog and price book, CSV imports), kept
 * apart from records.ts: a module's schemas are all built when any page loads it, and records.ts is in
 * the first chunk every signed-in page loads (the walk-through's first screen on a phone, issue 11).
 * These load with the pages that use them. `@contract` exports both files alike.
 */

const components = z.looseObject({ total: z.number() });
/** calc's HomeLoad goes out as calc made it; only what the client compares is named here, the rest passes. */
export const loadsResponse = z.object({
  jobId: id,
  jobVersion: z.number().int(),
  tightness: z.enum(TIGHTNESS),
  house: z.record(z.string(), z.unknown()).optional(),
  designConditions: z.record(z.string(), z.unknown()),
  loads: z.looseObject({
    rooms: z.array(
      z.looseObject({
        roomId: z.string(),
        roomName: z.string(),
        sensibleGain: components,
        latentGain: components,
        heatLoss: components,
        coolingTotalBtuh: z.number(),
      }),
    ),
    totals: z.looseObject({
      sensibleBtuh: z.number(),
      latentBtuh: z.number(),
      coolingBtuh: z.number(),
      heatingBtuh: z.number(),
      sensibleHeatRatio: z.number(),
    }),
  }),
  warnings: z.looseObject({
    designConditions: z.array(z.unknown()),
    rooms: z.record(z.string(), z.array(z.unknown())),
  }),
});
export type LoadsResponse = z.output<typeof loadsResponse>;

/** The catalog and price book: records are checked by calc's table schemas where they are used. */
export const companyDataRow = z.object({
  key: z.string(),
  version: z.number().int(),
  updatedAt: timestamp,
  record: z.record(z.string(), z.unknown()),
});
export type CompanyDataRowRecord = z.output<typeof companyDataRow>;
export const companyDataTablesResponse = z.object({
  tables: z.array(z.object({ id: z.string(), label: z.string(), canEdit: z.boolean() })),
});
export const companyDataTableResponse = z.object({ dataset: z.string(), rows: z.array(companyDataRow) });
export const companyDataRowResponse = z.object({ row: companyDataRow });
const cellChange = z.object({ column: z.string(), before: z.string(), after: z.string() });
export type CellChangeRecord = z.output<typeof cellChange>;
export const companyDataHistoryResponse = z.object({
  history: z.array(
    z.object({
      id,
      action: z.enum(['created', 'changed']),
      source: z.enum(['edit', 'import', 'seed']),
      changes: z.array(cellChange),
      changedBy: personRef.nullable(),
      changedAt: timestamp,
    }),
  ),
});
export type CompanyDataHistoryEntry = z.output<typeof companyDataHistoryResponse>['history'][number];
export const importPreview = z.object({
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
export type ImportPreviewRecord = z.output<typeof importPreview>;
export const importPreviewResponse = z.object({ preview: importPreview.extend({ token: z.string() }) });
export const importApplyResponse = z.object({ applied: importPreview });
/** Price-book settings as the role may see them (the sell rule only for the office). */
export const priceBookSettingsResponse = z.object({
  settings: z.looseObject({ taxRatePercent: z.number(), taxAppliesTo: z.unknown(), version: z.number().int() }),
});
