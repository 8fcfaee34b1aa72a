import type { DesignConditions } from '@calc';
import { designSourcesOf, resolveDesign, type DesignNotes, type DesignSources, type EnteredDesign } from '@contract';
import { ValidationError } from '../../lib/errors';

/**
 * The contract's resolution (entered → company default → standard default) for a job being saved:
 * calc's refusal becomes a 400 naming each `designConditions.<field>`.
 */
export function resolveDesignConditions(
  entered: EnteredDesign,
  notes: DesignNotes,
  companyDefault: DesignConditions | null,
): { conditions: DesignConditions; sources: DesignSources } {
  const r = resolveDesign(entered, companyDefault);
  if (!r.conditions) {
    throw new ValidationError(
      r.issues.map((e) => ({ path: `designConditions.${e.path || '(body)'}`, message: e.message })),
    );
  }
  return { conditions: r.conditions, sources: designSourcesOf(r.conditions, r.origin, notes) };
}
