import { useSuspenseQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { Button, buttonClass } from '../../../components/ui/button';
import { useCompanyName } from '../../../lib/company';
import { jobPaths } from '../../../entities/job/paths';
import { jobQueryOptions, roomsQueryOptions } from '../../../entities/job/queries';
import { computeHomeLoad } from '../model/compute';
import { lastChanged, summaryRevision } from '../model/print-text';
import { LoadSummarySheet } from './load-summary-sheet';
import { loadsParams } from './loads-page';
import { PrintStyles } from './print-styles';

/** /jobs/:jobId/loads/print — the one-page summary, with a print button that does not print. */
export function LoadPrintPage() {
  const { jobId } = loadsParams.parse(useParams());
  const job = useSuspenseQuery(jobQueryOptions(jobId)).data;
  const rooms = useSuspenseQuery(roomsQueryOptions(jobId)).data;
  const result = computeHomeLoad(rooms, job.designConditions, job.tightness, job.house ?? {});
  const companyName = useCompanyName();
  const date = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium' });
  const printedOn = date.format(new Date());
  const asOf = date.format(new Date(lastChanged(job, rooms)));
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
        <LoadSummarySheet
          job={job}
          load={result.value.load}
          companyName={companyName}
          printedOn={printedOn}
          asOf={asOf}
          revision={summaryRevision(job, rooms)}
        />
      ) : (
        <p>{result.message}</p>
      )}
    </div>
  );
}
