import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';

/** Placeholder until the Jobs feature lands; it replaces this module. */
export default function JobsRoute() {
  return (
    <>
      <PageHeader title="Jobs" lead="Every home you are quoting or installing, from the first walk-through to the signed proposal." />
      <EmptyState title="No jobs yet">
        Creating jobs arrives in the next release of Gaugeline. Once it does, each job you start or are given appears here.
      </EmptyState>
    </>
  );
}
