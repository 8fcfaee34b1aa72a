import { z } from 'zod';
import { DATASET_IDS, IMPORT_LIMITS, keyField } from '@calc';

export const datasetParams = z.strictObject({
  dataset: z.enum(DATASET_IDS, { message: `Unknown table: use one of ${DATASET_IDS.join(', ')}.` }),
});
export const rowParams = datasetParams.extend({ key: keyField('Key') });

/** A record in the shape of calc's schema for the table; checked by that schema in the service. */
export const recordBody = z.strictObject({
  record: z.record(z.string(), z.unknown(), { message: 'Send the record.' }),
});

const MB = IMPORT_LIMITS.maxBytes / 1_000_000;
export const importPreviewBody = z.strictObject({
  csv: z
    .string({ message: 'Send the file text as csv.' })
    .min(1, 'The file is empty.')
    .refine((s) => Buffer.byteLength(s, 'utf8') <= IMPORT_LIMITS.maxBytes, {
      message: `The file is larger than the ${MB} MB limit. Split it into smaller files.`,
    }),
});
export const importApplyBody = importPreviewBody.extend({
  token: z.string().regex(/^[A-Za-z0-9_-]{43}$/, 'Preview the file first; send the token the preview gave.'),
});
