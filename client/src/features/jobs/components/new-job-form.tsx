import { useRef } from 'react';
import { useNavigate } from 'react-router-dom';
import { Form } from '../../../components/ui/form';
import { SelectField, SubmitButton, TextField } from '../../../components/ui/form-fields';
import { SiteFields } from './site-fields';
import { jobPaths } from '../../../entities/job/paths';
import { useCreateJob } from '../api/create-job';
import { newJobSchema, type NewJobInput } from '../schemas';
import { CustomerPicker } from './customer-picker';

const empty: NewJobInput = {
  customerMode: 'new',
  customerId: '',
  customerName: '',
  customerEmail: '',
  customerPhone: '',
  street: '',
  unit: '',
  city: '',
  region: '',
  postalCode: '',
  notes: '',
};

/** Customer (new or existing) and the site address; the walk-through opens next. */
export function NewJobForm() {
  const createJob = useCreateJob();
  const navigate = useNavigate();
  const madeCustomer = useRef<string | null>(null);
  return (
    <Form
      schema={newJobSchema}
      defaultValues={empty}
      aria-label="New job"
      onSubmit={async (values) => {
        const job = await createJob.mutateAsync({
          values,
          madeCustomerId: madeCustomer.current,
          onCustomer: (id) => (madeCustomer.current = id),
        });
        await navigate(jobPaths.walkthrough(job.id));
      }}
    >
      {(form) => (
        <>
          <fieldset className="flex flex-col gap-4">
            <legend className="mb-2 text-lg font-semibold text-ink-900">Customer</legend>
            <SelectField
              name="customerMode"
              label="Customer"
              options={[
                { value: 'new', label: 'New customer' },
                { value: 'existing', label: 'Existing customer' },
              ]}
            />
            {form.watch('customerMode') === 'existing' ? (
              <CustomerPicker />
            ) : (
              <div className="grid gap-4 sm:grid-cols-3">
                <TextField name="customerName" label="Customer name" autoComplete="off" />
                <TextField
                  name="customerEmail"
                  label="Customer e-mail"
                  type="email"
                  inputMode="email"
                  autoComplete="off"
                />
                <TextField name="customerPhone" label="Customer phone" type="tel" inputMode="tel" autoComplete="off" />
              </div>
            )}
          </fieldset>
          <SiteFields legendClass="mb-2 text-lg font-semibold text-ink-900" />
          <p className="text-sm text-muted">
            The site’s design conditions start from your company’s defaults; check them on the next screen.
          </p>
          <div>
            <SubmitButton>Create job and start the walk-through</SubmitButton>
          </div>
        </>
      )}
    </Form>
  );
}
