import { Card } from '../../../components/ui/card';
import { PageHeader } from '../../../components/ui/page-header';
import { NewJobForm } from './new-job-form';

export function NewJobPage() {
  return (
    <div className="max-w-3xl">
      <PageHeader title="New job" lead="Who the customer is and where the home is. Rooms come next." />
      <Card>
        <NewJobForm />
      </Card>
    </div>
  );
}
