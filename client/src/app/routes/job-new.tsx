import { NewJobPage } from '../../features/jobs/components/new-job-page';

/** /jobs/new */
export default function NewJobRoute() {
  return <NewJobPage />;
}
