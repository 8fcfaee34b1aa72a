import { designConditionsSchema, designConditionsWarnings, roomInputSchema } from '@calc';
import { useSuspenseQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { z } from 'zod';
import { QueryWidgetBoundary } from '../../../components/errors/query-widget-boundary';
import { buttonClass } from '../../../components/ui/button';
import { PageHeader } from '../../../components/ui/page-header';
import { jobPaths } from '../../../entities/job/paths';
import { jobQueryOptions, roomsQueryOptions } from '../../../entities/job/queries';
import { OfflineNotice } from '../../../lib/offline/offline-notice';
import { computeHomeLoad } from '../model/compute';
import { MethodNote } from './estimate-note';
import { HomeTotals } from './home-totals';
import { RoomLoadCard } from './room-load-card';

export const loadsParams = z.object({ jobId: z.uuid({ message: 'That is not a job address.' }) });

/** /jobs/:jobId/loads — the saved rooms' loads worked out in the browser (the same calc the server runs). */
export function LoadsPage({ waiting = 0 }: { waiting?: number }) {
  const { jobId } = loadsParams.parse(useParams());
  const jobQuery = useSuspenseQuery(jobQueryOptions(jobId));
  const roomsQuery = useSuspenseQuery(roomsQueryOptions(jobId));
  const job = jobQuery.data;
  const rooms = roomsQuery.data;
  const result = computeHomeLoad(rooms, job.designConditions, job.tightness, job.house ?? {});
  const parsedRooms = new Map(
    rooms.flatMap((r) => {
      const p = roomInputSchema.safeParse({ ...r.input, id: r.id });
      return p.success ? [[r.id, p.data] as const] : [];
    }),
  );
  const ducted = job.house?.ducts != null;
  const conditions = designConditionsSchema.safeParse(job.designConditions ?? {});
  const conditionWarnings = conditions.success ? designConditionsWarnings(conditions.data) : [];

  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        title={`Loads — ${job.customer.name}`}
        lead="Hour by hour through the design day: each room’s own peak, and the whole home’s block load."
        actions={
          <div className="flex flex-wrap gap-2">
            <Link className={buttonClass('secondary')} to={jobPaths.walkthrough(jobId)}>
              Back to the walk-through
            </Link>
            <Link className={buttonClass('primary')} to={jobPaths.print(jobId)}>
              Printable summary
            </Link>
            <Link className={buttonClass('secondary')} to={jobPaths.desk(jobId)}>
              Options and price
            </Link>
          </div>
        }
      />
      <OfflineNotice updatedAt={Math.min(jobQuery.dataUpdatedAt, roomsQuery.dataUpdatedAt)} waiting={waiting} />
      {waiting > 0 ? (
        <p className="text-sm text-muted">
          These figures are the saved rooms; changes still waiting on this phone are not in them yet.
        </p>
      ) : null}
      {!result.ok ? <p className="rounded-md border border-line bg-white p-4">{result.message}</p> : null}
      {result.ok ? (
        <>
          <HomeTotals load={result.value.load} skipped={result.value.skipped} chart />
          {conditionWarnings.length > 0 ? (
            <ul className="list-disc rounded-md bg-amber-soft py-2 pl-8 text-sm text-amber-deep">
              {conditionWarnings.map((w) => (
                <li key={w.message}>{w.message}</li>
              ))}
            </ul>
          ) : null}
          <div className="grid gap-4 lg:grid-cols-2">
            {result.value.load.rooms.map((l) => (
              <QueryWidgetBoundary key={l.roomId} name={`the loads of ${l.roomName}`}>
                <RoomLoadCard load={l} room={parsedRooms.get(l.roomId)} ducts={ducted} />
              </QueryWidgetBoundary>
            ))}
          </div>
        </>
      ) : null}
      <MethodNote />
    </div>
  );
}
