import { useMutation } from '@tanstack/react-query';
import { suggestResponse } from '@contract';
import { designSchema, type Design } from '@calc';
import { jobPath } from '../../../entities/job/paths';
import { apiFetch } from '../../../lib/api-client';
import { ApiError } from '../../../lib/api-error';

/**
 * POST /api/jobs/:jobId/suggest — calc's units from the active catalog for the job's zones (the rooms
 * grouped as the option has them, or calc's grouping), with why each was chosen. Nothing is stored.
 */
export function useSuggest(jobId: string) {
  return useMutation({
    // The option's stored design: its zones are kept, and the line sets already entered are not overwritten.
    mutationFn: async (stored: Design | undefined) => {
      const answer = await apiFetch(`${jobPath(jobId)}/suggest`, {
        method: 'POST',
        body:
          stored && stored.zones.length > 0
            ? {
                zones: stored.zones.map(({ indoorUnitKey: _, ...z }) => z),
                circuits: stored.systems.flatMap((s) => s.circuits),
              }
            : {},
        schema: suggestResponse,
      });
      const design = designSchema.safeParse(answer.design);
      if (!design.success)
        throw new ApiError({
          status: 422,
          code: 'calc',
          title: 'No suggestion',
          detail: 'The catalog has nothing that fits.',
        });
      return { design: design.data, reasons: answer.reasons, warnings: answer.warnings };
    },
  });
}
