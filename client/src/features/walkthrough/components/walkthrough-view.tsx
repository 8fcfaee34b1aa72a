import { useQuery, useSuspenseQuery } from '@tanstack/react-query';
import { Suspense, useEffect, useRef, useState, type ReactNode } from 'react';
import { mayEditJob, type JobRecord } from '@contract';
import { Link } from 'react-router-dom';
import { QueryWidgetBoundary } from '../../../components/errors/query-widget-boundary';
import { Alert } from '../../../components/ui/alert';
import { Button, buttonClass } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { jobPaths } from '../../../entities/job/paths';
import { useViewer } from '../../../lib/viewer';
import { useAfterIdle } from '../../../lib/use-after-idle';
import { companySettingsQueryOptions, jobQueryOptions, roomsQueryOptions } from '../../../entities/job/queries';
import { LiveHomeTotals } from '../../loads/components/live-home-totals';
import { roomTarget } from '../sync/edits';
import { overlayJob, overlayRooms } from '../sync/overlay';
import { usePhotoQueue } from '../sync/photo-queue-context';
import { useQueueState, useWalkthroughQueue } from '../sync/queue-context';
import { ConflictPanel } from './conflict-panel';
import { DesignConditionsForm } from './design-conditions-form';
import { LiveSaveStatus } from './live-save-status';
import { PhotoRefusals } from './photo-refusals';
import { ReadOnlyJob } from './read-only-job';
import { RoomEditor } from './room-editor';
import { RoomListActions } from './room-list-actions';
import { RoomTabs } from './room-tabs';
import { UnitSystemContext } from './unit-system';
import { clearUnsavedDraft } from '../../../lib/offline/drafts';
import { lastRoom, rememberRoom } from '../model/last-room';

const detailsPlaceholder = <div className="min-h-touch rounded-lg border border-line bg-white p-4" />;

/**
 * The walk-through of one job: design conditions, rooms one at a time, live loads.
 *
 * The server's records and the queue are read in this one component on purpose: when a write
 * lands, the query cache gains the record a moment before the queue drops the edit, and a
 * render that saw the new queue with older records handed down from a parent would lose the
 * room for one frame — the editor would show another room and remount, dropping the focus
 * and whatever was being typed. Both reads here see the same moment.
 */
export function WalkthroughView({
  jobId,
  jobDetails,
}: {
  jobId: string;
  /** The job's own details (the jobs feature's panel), folded above the design conditions; the route composes it. */
  jobDetails?: (job: JobRecord) => ReactNode;
}) {
  const queue = useWalkthroughQueue();
  const photos = usePhotoQueue();
  const state = useQueueState();
  const serverJob = useSuspenseQuery(jobQueryOptions(jobId)).data;
  const serverRooms = useSuspenseQuery(roomsQueryOptions(jobId)).data;
  // Settings only change units and defaults; the walk-through works without them.
  const settings = useQuery(companySettingsQueryOptions()).data ?? null;
  const rooms = overlayRooms(serverJob.id, serverRooms, state.items);
  const { job } = overlayJob(serverJob, state.items, settings?.defaultDesignConditions ?? null);
  // A reload opens the room last open here (the person was in the middle of it).
  const [selected, setSelected] = useState<string | null>(() => lastRoom(jobId));
  const roomTop = useRef<HTMLDivElement>(null);
  const scrollToRoom = useRef(false);
  const [revision, setRevision] = useState(0);
  const viewer = useViewer();
  // The folded job details come once the rooms can be typed into (they load a chunk and fetch the customer and staff).
  const detailsNow = useAfterIdle();
  // The design conditions' form (a fold of its own, closed once they are entered) renders when first opened:
  // closed, it was a quarter of the page's first render (issue 11).
  const [designOpen, setDesignOpen] = useState(() => job.designConditions === null);
  const current = rooms.find((r) => r.id === selected) ?? rooms[0] ?? null;
  const conflict = state.conflict && state.conflict.payload.jobId === job.id ? state.conflict : null;
  useEffect(() => {
    if (current) rememberRoom(jobId, current.id);
  }, [jobId, current?.id]); // eslint-disable-line react-hooks/exhaustive-deps
  // A room picked or added starts at its top (its name), not wherever the last one was scrolled to;
  // a reload returns to the room last open; a job opened fresh (after "Create job") starts at the top.
  const firstRoom = useRef(current?.id === selected && selected !== null);
  useEffect(() => {
    if (!state.loaded) return;
    if (scrollToRoom.current || firstRoom.current) roomTop.current?.scrollIntoView?.({ block: 'start' });
    else window.scrollTo?.(0, 0);
    scrollToRoom.current = false;
    firstRoom.current = false;
  }, [current?.id, state.loaded]);
  const openRoom = (id: string) => {
    scrollToRoom.current = true;
    setSelected(id);
  };
  const address = [job.site.street, job.site.unit, job.site.city, job.site.region].filter(Boolean).join(', ');

  const handleDelete = () => {
    if (!current || !window.confirm(`Delete ${String(current.input.name ?? 'this room')} and its photos?`)) return;
    clearUnsavedDraft(current.id);
    // The person was asked about the room "and its photos": ones still on the device go too.
    void photos.discardRoom(current.id);
    void queue.enqueue({
      target: roomTarget(current.id),
      baseVersion: current.version,
      payload: { kind: 'room-delete', jobId: job.id, roomId: current.id },
    });
    setSelected(null);
  };

  // Waiting edits from an earlier visit must be laid over the server's values before anyone types.
  if (!state.loaded) return <Spinner label="Restoring changes kept on this device…" />;
  // Someone the contract does not let edit the job (an installer) reads it: no inputs, no save pill.
  if (viewer !== null && !mayEditJob(viewer.role))
    return <ReadOnlyJob job={job} rooms={rooms} unitSystem={settings?.unitSystem ?? 'imperial'} />;

  return (
    <UnitSystemContext.Provider value={settings?.unitSystem ?? 'imperial'}>
      <div className="flex flex-col gap-6 pb-24">
        {/* Sticky on a phone: who, the save status, and the rooms with "Add room" and "Copy room",
            so moving to the next room never needs a scroll back up. */}
        <header className="sticky top-0 z-10 -mx-4 flex flex-col gap-2 border-b border-line bg-paper/95 px-4 py-2 backdrop-blur">
          <div className="flex flex-wrap items-center justify-between gap-x-3 gap-y-1">
            <div className="min-w-0 flex-1 basis-40">
              <h1 className="truncate text-xl font-semibold text-ink-900">{job.customer.name}</h1>
              <p className="hidden truncate text-sm text-muted sm:block">{address}</p>
            </div>
            <div className="flex flex-wrap items-center gap-2">
              <LiveSaveStatus />
              {/* On a phone the pinned load bar and the link under the header take its place. */}
              <span className="hidden gap-2 sm:flex">
                <JobPageLinks job={job} />
              </span>
            </div>
          </div>
          <nav aria-label="Rooms of this job" className="flex flex-col gap-2 lg:flex-row lg:items-center lg:gap-4">
            <div className="min-w-0 lg:flex-1">
              <RoomTabs rooms={rooms} selectedId={current?.id ?? null} onSelect={openRoom} />
            </div>
            <RoomListActions jobId={job.id} rooms={rooms} current={current} onCreated={openRoom} />
          </nav>
        </header>

        <div className="-mt-3 flex flex-wrap items-center justify-between gap-2 sm:hidden">
          <p className="min-w-0 text-sm text-muted">{address}</p>
          <div className="flex flex-wrap gap-2">
            <JobPageLinks job={job} />
          </div>
        </div>

        {conflict ? (
          <ConflictPanel key={conflict.id} item={conflict} onResolved={() => setRevision((r) => r + 1)} />
        ) : null}
        {state.blocked ? (
          <Alert tone="warning" title="Changes are not being saved right now.">
            {state.blocked}
          </Alert>
        ) : null}
        {state.rejected ? (
          <Alert tone="danger" title="One change was not accepted and was not saved.">
            <p>{state.rejected}</p>
            <Button variant="secondary" className="mt-2" onClick={() => queue.dismissRejected()}>
              Dismiss
            </Button>
          </Alert>
        ) : null}
        {/* A refused photo of a room not on screen (or no longer there) is told here. */}
        <PhotoRefusals show={(n) => n.jobId === job.id && n.roomId !== current?.id} />

        {jobDetails ? (
          <QueryWidgetBoundary name="the job details">
            <Suspense fallback={detailsPlaceholder}>{detailsNow ? jobDetails(job) : detailsPlaceholder}</Suspense>
          </QueryWidgetBoundary>
        ) : null}

        <details
          className="rounded-lg border border-line bg-white p-4"
          open={job.designConditions === null}
          // Made when first opened and kept (closing only hides it): a form drawn hidden still costs a phone
          // layout whenever the browser looks at its fields (issue 11).
          onToggle={(e) => {
            if (e.currentTarget.open) setDesignOpen(true);
          }}
        >
          <summary className="min-h-touch cursor-pointer text-lg font-semibold text-ink-900">
            Site design conditions
          </summary>
          {designOpen || job.designConditions === null ? (
            <QueryWidgetBoundary name="the design conditions">
              <DesignConditionsForm
                key={`${job.id}:${revision}`}
                job={job}
                companyDefaults={settings?.defaultDesignConditions ?? null}
                notice={settings?.designConditionsNotice}
              />
            </QueryWidgetBoundary>
          ) : null}
        </details>

        <section aria-label="Walk-through rooms" className="flex flex-col gap-4">
          <h2 className="text-lg font-semibold text-ink-900">Rooms</h2>
          {current ? (
            <div ref={roomTop} className="scroll-mt-56 rounded-lg border border-line bg-white p-4">
              <QueryWidgetBoundary name="the room form">
                <RoomEditor
                  key={`${current.id}:${revision}`}
                  jobId={job.id}
                  room={current}
                  designConditions={job.designConditions}
                  tightness={job.tightness}
                  home={{ rooms, house: job.house }}
                />
              </QueryWidgetBoundary>
              <Button variant="danger" className="mt-6" onClick={handleDelete}>
                Delete this room
              </Button>
            </div>
          ) : (
            <EmptyState title="No rooms yet">
              Pick a template at the top and add the first room, then walk the house room by room.
            </EmptyState>
          )}
        </section>

        <QueryWidgetBoundary name="the whole-home loads">
          <LiveHomeTotals
            rooms={rooms}
            designConditions={job.designConditions}
            tightness={job.tightness}
            house={job.house}
          />
        </QueryWidgetBoundary>
      </div>
    </UnitSystemContext.Provider>
  );
}

/** The job's other pages, beside the save status on a wide screen and under the header on a phone. */
function JobPageLinks({ job }: { job: JobRecord }) {
  const jobId = job.id;
  const viewer = useViewer();
  return (
    <>
      <Link className={buttonClass('secondary')} to={jobPaths.loads(jobId)}>
        Loads summary
      </Link>
      <Link className={buttonClass('secondary')} to={jobPaths.desk(jobId)}>
        Options and price
      </Link>
      {/* The proposal once there is one, or once the office has marked the job ready to propose. */}
      {job.hasProposal || job.readyToProposeAt ? (
        <Link className={buttonClass('secondary')} to={jobPaths.proposal(jobId)}>
          Proposal
        </Link>
      ) : null}
      {/* The installer's commissioning record (issue 15) once the job is won; a salesperson has none. */}
      {(job.status === 'won' || job.status === 'installed') && viewer && viewer.role !== 'salesperson' ? (
        <Link className={buttonClass('secondary')} to={jobPaths.commissioning(jobId)}>
          Commissioning record
        </Link>
      ) : null}
      {(job.status === 'won' || job.status === 'installed') && viewer && viewer.role !== 'salesperson' ? (
        <Link className={buttonClass('secondary')} to={jobPaths.packet(jobId)}>
          Job packet
        </Link>
      ) : null}
    </>
  );
}
