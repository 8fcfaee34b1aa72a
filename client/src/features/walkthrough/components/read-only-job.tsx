import type { JobRecord, UnitSystem } from '@contract';
import { Link } from 'react-router-dom';
import { buttonClass } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { jobPaths } from '../../../entities/job/paths';
import { jobStatusText } from '../../../entities/job/labels';
import { toDisplay, unitLabel } from '../../../lib/unit-display';
import type { RoomView } from '../sync/overlay';
import { JobPeopleFacts } from '../../../entities/job/job-people';

/**
 * The job as someone who may not change it sees it (an installer, by the contract's `mayEditJob`):
 * the site, who it is with, the notes and each room with its size, notes and photos. Nothing here
 * can be typed into or saved, so nothing claims to be saved.
 */
export function ReadOnlyJob({
  job,
  rooms,
  unitSystem,
}: {
  job: JobRecord;
  rooms: readonly RoomView[];
  unitSystem: UnitSystem;
}) {
  const address = [job.site.street, job.site.unit, job.site.city, job.site.region, job.site.postalCode]
    .filter(Boolean)
    .join(', ');
  return (
    <div className="flex flex-col gap-6 pb-24">
      <header className="flex flex-wrap items-center justify-between gap-2">
        <div>
          <h1 className="text-xl font-semibold text-ink-900">{job.customer.name}</h1>
          <p className="text-sm text-muted">{address}</p>
        </div>
        <div className="flex flex-wrap gap-2">
          <Link className={buttonClass('secondary')} to={jobPaths.loads(job.id)}>
            Loads summary
          </Link>
          {/* The desk without money: the units, line sets, charge and electrical an installer works from. */}
          <Link className={buttonClass('secondary')} to={jobPaths.desk(job.id)}>
            Equipment and line sets
          </Link>
        </div>
      </header>

      <section aria-labelledby="job-facts" className="rounded-lg border border-line bg-white p-4">
        <h2 id="job-facts" className="text-lg font-semibold text-ink-900">
          The job
        </h2>
        <dl className="mt-2 grid gap-2 text-base sm:grid-cols-3">
          <div>
            <dt className="text-sm font-semibold text-muted">Status</dt>
            <dd>{jobStatusText(job)}</dd>
          </div>
          <JobPeopleFacts job={job} />
        </dl>
        <h3 className="mt-4 text-base font-semibold text-ink-900">Notes</h3>
        <p className="whitespace-pre-line text-base">{job.notes || 'No notes.'}</p>
      </section>

      <section aria-labelledby="job-rooms" className="flex flex-col gap-4">
        <h2 id="job-rooms" className="text-lg font-semibold text-ink-900">
          Rooms
        </h2>
        {rooms.length === 0 ? (
          <EmptyState title="No rooms yet">The salesperson has not walked this house yet.</EmptyState>
        ) : (
          rooms.map((room, i) => <RoomCard key={room.id} room={room} index={i} unitSystem={unitSystem} />)
        )}
      </section>
    </div>
  );
}

function RoomCard({ room, index, unitSystem }: { room: RoomView; index: number; unitSystem: UnitSystem }) {
  const { name, lengthFt, widthFt, areaFt2, notes } = room.input as Record<string, unknown>;
  const title = typeof name === 'string' && name ? name : `Room ${index + 1}`;
  const length = (ft: number) => `${round(toDisplay('ft', unitSystem, ft))} ${unitLabel('ft', unitSystem)}`;
  const size =
    typeof lengthFt === 'number' && typeof widthFt === 'number'
      ? `${length(lengthFt)} × ${length(widthFt)}`
      : typeof areaFt2 === 'number'
        ? `${round(toDisplay('ft2', unitSystem, areaFt2))} ${unitLabel('ft2', unitSystem)}`
        : null;
  return (
    <article aria-label={title} className="rounded-lg border border-line bg-white p-4">
      <h3 className="text-lg font-semibold text-ink-900">{title}</h3>
      {size ? <p className="text-base text-ink-800">{size}</p> : null}
      {typeof notes === 'string' && notes ? <p className="mt-2 whitespace-pre-line text-base">{notes}</p> : null}
      {room.photos.length > 0 ? (
        <ul className="mt-3 flex flex-wrap gap-2" aria-label={`Photos of ${title}`}>
          {room.photos.map((p, i) => (
            <li key={p.id}>
              <a href={p.url} target="_blank" rel="noreferrer">
                <img
                  src={p.url}
                  alt={`Photo ${i + 1} of ${room.photos.length} of ${title}`}
                  loading="lazy"
                  className="size-24 rounded-md border border-line object-cover"
                />
              </a>
            </li>
          ))}
        </ul>
      ) : (
        <p className="mt-2 text-sm text-muted">No photos.</p>
      )}
    </article>
  );
}

const round = (n: number) => Math.round(n * 10) / 10;
