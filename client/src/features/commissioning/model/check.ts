import { z } from 'zod';
import {
  evacuationInput,
  leakInput,
  measuredLineInput,
  pressureTestInput,
  startupReadingInput,
  type CommissioningRecord,
} from '@contract';

/** The parts of the record a person enters step by step (each saved as entered). */
export type Parts = Pick<
  CommissioningRecord,
  'pressureTest' | 'leaks' | 'evacuation' | 'measuredLines' | 'startup' | 'notes'
>;
export type StepKey = keyof Parts;

export const STEP_LABELS: Record<StepKey, string> = {
  pressureTest: 'Pressure test',
  leaks: 'Leaks found and fixed',
  evacuation: 'Evacuation',
  measuredLines: 'Measured line lengths',
  startup: 'Start-up readings',
  notes: 'Notes',
};

const schemas: Record<StepKey, z.ZodType> = {
  pressureTest: pressureTestInput,
  leaks: z.array(leakInput).max(30),
  evacuation: evacuationInput,
  measuredLines: z.array(measuredLineInput).max(40),
  startup: z.array(startupReadingInput).max(30),
  notes: z.string().max(4000, { message: 'Notes must be at most 4000 characters.' }),
};

export const partsOf = (r: CommissioningRecord): Parts => ({
  pressureTest: r.pressureTest,
  leaks: r.leaks,
  evacuation: r.evacuation,
  measuredLines: r.measuredLines,
  startup: r.startup,
  notes: r.notes,
});

/**
 * The refusals for one step, by field path ("testPsig", "0.where"), with the contract's words (the server
 * checks the same rules); the equipment's test pressure as the server gives it, with its reason.
 */
export function checkStep(key: StepKey, value: unknown, limitPsig: number | null): Record<string, string> {
  const out: Record<string, string> = {};
  const r = schemas[key].safeParse(value);
  if (!r.success)
    for (const issue of r.error.issues) {
      const path = issue.path.join('.');
      out[path] ??= issue.message;
    }
  if (key === 'pressureTest' && limitPsig !== null) {
    const p = value as Parts['pressureTest'];
    const why = `Above the equipment’s test pressure (${limitPsig} psig from the catalog): going above it can damage the coil, valves or joints. Never exceed the nameplate or manual value.`;
    if (p.testPsig !== null && p.testPsig > limitPsig) out.testPsig ??= why;
    if (p.startPsig !== null && p.startPsig > limitPsig) out.startPsig ??= why;
  }
  return out;
}
