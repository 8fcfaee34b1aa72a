import { useSuspenseQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { Button, buttonClass } from '../../../components/ui/button';
import { jobPaths } from '../../../lib/job-paths';
import { jobQueryOptions, roomsQueryOptions } from '../../../lib/job-queries';
import { computeHomeLoad } from '../model/compute';
import { LoadSummarySheet } from './load-summary-sheet';
import { loadsParams } from './loads-page';
import { PrintStyles } from './print-styles';

/** /jobs/:jobId/loads/print — the one-page summary, with a print button that does not print. */
export function LoadPrintPage() {
  const { jobId } = loadsParams.parse(useParams());
  const job = useSuspenseQuery(jobQueryOptions(jobId)).data;
  const rooms = useSuspenseQuery(roomsQueryOptions(jobId)).data;
  const result = computeHomeLoad(rooms, job.designConditions, job.tightness, job.house ?? {});
  const printedOn = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium' }).format(new Date());
  return (
    <div className="flex flex-col gap-4">
      <PrintStyles />
      <div className="no-print flex flex-wrap gap-2 print:hidden">
        <Button onClick={() => window.print()}>Print</Button>
        <Link className={buttonClass('secondary')} to={jobPaths.loads(jobId)}>
          Back to the loads
        </Link>
      </div>
      {result.ok ? (
        <LoadSummarySheet job={job} load={result.value.load} printedOn={printedOn} />
      ) : (
        <p>{result.message}</p>
      )}
    </div>
  );
}
