import { DeskPage } from '../../features/desk/components/desk-page';

/** /jobs/:jobId/desk — the estimator's desk; loader: app/job-desk-loader.ts. */
export default function JobDeskRoute() {
  return <DeskPage />;
}
