import { z } from 'zod';
import { loadsResponse, type LoadsResponse } from '@contract';
import { ANY_STAFF, type ApiRouter } from '../../lib/route';
import { jobLoads } from './loads.service';

const params = z.strictObject({ id: z.uuid({ message: 'Must be a job id.' }) });

/** Mounted under /api/jobs. */
export function loadsRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/:id/loads',
    policy: ANY_STAFF,
    params,
    response: loadsResponse,
    handler: async ({ service, params: p }) => {
      const r = await jobLoads(service, p.id);
      // calc's result is plain JSON by contract, so it is sent as calc made it.
      return {
        jobId: r.job.id,
        jobVersion: r.job.version,
        tightness: r.job.tightness,
        house: { ...r.job.house },
        designConditions: r.designConditions,
        // calc's HomeLoad (readonly interfaces) is the document; the test app checks it against the schema.
        loads: r.load as unknown as LoadsResponse['loads'],
        warnings: r.warnings as LoadsResponse['warnings'],
      };
    },
  });
}
