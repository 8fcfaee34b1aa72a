import { mayReviewOption, type OptionRecord } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { errorMessage } from '../../../lib/api-error';
import type { Viewer } from '../../../lib/viewer';
import { useReviewOption } from '../api/review-option';

const when = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short' });

/**
 * A first price from the phone: marked preliminary until an estimator or the owner reviews it (the button,
 * for them); afterwards, who reviewed it and when.
 */
export function FirstPriceReview({ jobId, option, viewer }: { jobId: string; option: OptionRecord; viewer: Viewer }) {
  const review = useReviewOption(jobId);
  if (!option.preliminary)
    return option.reviewedBy && option.reviewedAt ? (
      <p className="text-sm text-muted">
        First price from the walk-through, reviewed by {option.reviewedBy.name} on{' '}
        {when.format(new Date(option.reviewedAt))}.
      </p>
    ) : null;
  return (
    <Alert tone="warning" title="Preliminary">
      <p>A first price from the walk-through; an estimator or the owner reviews it before it is proposed.</p>
      {mayReviewOption(viewer.role) ? (
        <div className="mt-2 flex flex-col gap-1">
          <Button className="self-start" busy={review.isPending} onClick={() => review.mutate(option)}>
            Review first price
          </Button>
          <span className="text-sm">Check the units, lines and price first: the review lets it be proposed.</span>
          {review.isError ? (
            <p role="alert" className="font-semibold text-danger">
              {errorMessage(review.error)}
            </p>
          ) : null}
        </div>
      ) : null}
    </Alert>
  );
}
