import { mayEditJob } from '@contract';
import { Link } from 'react-router-dom';
import { Alert } from '../../../components/ui/alert';
import { Card } from '../../../components/ui/card';
import { PageHeader } from '../../../components/ui/page-header';
import { jobPaths } from '../../../entities/job/paths';
import { useViewer } from '../../../lib/viewer';
import { NewJobForm } from './new-job-form';

export function NewJobPage() {
  const viewer = useViewer();
  if (viewer !== null && !mayEditJob(viewer.role))
    return (
      <div className="max-w-3xl">
        <PageHeader title="New job" />
        <Alert tone="info" title="Jobs are started by the office and salespeople.">
          The jobs assigned to you are under <Link to={jobPaths.list}>Jobs</Link>.
        </Alert>
      </div>
    );
  return (
    <div className="max-w-3xl">
      <PageHeader title="New job" lead="Who the customer is and where the home is. Rooms come next." />
      <Card>
        <NewJobForm />
      </Card>
    </div>
  );
}
