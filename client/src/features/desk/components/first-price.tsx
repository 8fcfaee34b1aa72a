import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { mayEditOptions } from '@contract';
import { Button, buttonClass } from '../../../components/ui/button';
import { jobPaths } from '../../../entities/job/paths';
import { errorMessage } from '../../../lib/api-error';
import { useViewer } from '../../../lib/viewer';
import { useFirstPrice } from '../api/first-price';
import { deskQueryOptions } from '../api/get-desk';

/**
 * The salesperson's one tap after the walk-through: the server fills one option from the catalog's
 * suggestion and the price book, and the range shows here, marked preliminary (it is never sent as a
 * proposal until the office has reviewed it).
 */
export function FirstPrice({ jobId }: { jobId: string }) {
  const viewer = useViewer();
  const allowed = viewer !== null && mayEditOptions(viewer.role);
  const desk = useQuery({ ...deskQueryOptions(jobId), enabled: allowed });
  const make = useFirstPrice(jobId);
  if (!allowed) return null;
  const held = make.data?.range ?? desk.data?.options.find((o) => o.preliminary)?.result?.preliminaryRange ?? null;
  return (
    <section
      aria-labelledby="first-price"
      className="flex flex-col gap-3 rounded-lg border-2 border-amber-line bg-white p-4"
    >
      <h2 id="first-price" className="text-lg font-semibold text-ink-900">
        First price
      </h2>
      {held ? (
        <div className="flex flex-col gap-1" role="status">
          <p className="w-fit rounded-full bg-amber-soft px-3 py-1 text-sm font-bold uppercase tracking-wide text-amber-deep">
            Preliminary
          </p>
          <p className="text-2xl font-semibold text-ink-900">{held.text}</p>
          <p className="text-base text-ink-900">{held.note}</p>
        </div>
      ) : (
        <p className="text-base text-muted">
          When the rooms are in, one tap suggests the equipment from your catalog and shows a price range you can give
          the homeowner. It is preliminary: an estimator reviews it before any proposal.
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        {held ? null : (
          <Button busy={make.isPending} onClick={() => make.mutate()}>
            First price
          </Button>
        )}
        <Link className={buttonClass('secondary')} to={jobPaths.desk(jobId)}>
          Options and price
        </Link>
      </div>
      {make.isError ? (
        <p role="alert" className="text-sm font-semibold text-danger">
          {errorMessage(make.error)}
        </p>
      ) : null}
    </section>
  );
}
