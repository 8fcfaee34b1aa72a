import { useEffect, useRef, useState } from 'react';
import { ADDRESS_FIELDS, type CustomerRecord } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { findSameCustomer, lastSiteOf } from '../api/find-customer';
import { sameCustomerOf, type SameCustomer } from '../api/create-customer';
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

const SITE_FIELDS = ADDRESS_FIELDS;

/** An existing customer's last site fills the site fields still empty (all editable). */
async function fillSite(
  form: {
    getValues: (k: (typeof SITE_FIELDS)[number]) => string;
    setValue: (k: (typeof SITE_FIELDS)[number], v: string) => void;
  },
  customer: Pick<CustomerRecord, 'id' | 'name'>,
) {
  const site = await lastSiteOf(customer).catch(() => null);
  if (!site) return;
  if (SITE_FIELDS.some((k) => form.getValues(k).trim() !== '')) return;
  for (const k of SITE_FIELDS) form.setValue(k, site[k]);
}

/** Customer (new or existing) and the site address; the walk-through opens next. */
export function NewJobForm() {
  const createJob = useCreateJob();
  const navigate = useNavigate();
  const madeCustomer = useRef<string | null>(null);
  // A customer with the same e-mail or phone: asked about before a second one is made (the browser asks
  // the server while the contact is typed; the server's 409 on create is the check that counts).
  const [same, setSame] = useState<SameCustomer | null>(null);
  const newAnyway = useRef(false);
  const [picked, setPicked] = useState('');
  // Asked after "Create job" the question sits above the fold of a phone: bring it into view.
  const question = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (same) question.current?.scrollIntoView?.({ block: 'center', behavior: 'smooth' });
  }, [same]);
  return (
    <Form
      schema={newJobSchema}
      defaultValues={empty}
      aria-label="New job"
      onSubmit={async (values) => {
        let job;
        try {
          job = await createJob.mutateAsync({
            values,
            madeCustomerId: madeCustomer.current,
            onCustomer: (id) => (madeCustomer.current = id),
            createAnyway: newAnyway.current,
          });
        } catch (e) {
          const existing = sameCustomerOf(e);
          if (!existing) throw e;
          setSame(existing);
          return;
        }
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
            <SameCustomerWatch
              email={form.watch('customerEmail')}
              phone={form.watch('customerPhone')}
              active={form.watch('customerMode') === 'new' && !newAnyway.current}
              onFound={setSame}
            />
            {same && form.watch('customerMode') === 'new' ? (
              <div ref={question}>
                <Alert tone="warning" title="Use the existing customer?">
                  <p>
                    {same.name} already has {[same.email, same.phone].filter(Boolean).join(' · ')}.
                  </p>
                  <div className="mt-2 flex flex-wrap gap-2">
                    <Button
                      onClick={() => {
                        form.setValue('customerMode', 'existing');
                        form.setValue('customerId', same.id, { shouldValidate: true });
                        setPicked(same.name);
                        setSame(null);
                        void fillSite(form, same);
                      }}
                    >
                      Use {same.name}
                    </Button>
                    <Button type="submit" variant="secondary" onClick={() => (newAnyway.current = true)}>
                      No, a new customer
                    </Button>
                  </div>
                </Alert>
              </div>
            ) : null}
            {form.watch('customerMode') === 'existing' ? (
              <CustomerPicker key={picked} initialSearch={picked} onPick={(c) => void fillSite(form, c)} />
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

/** Asks the server, a moment after the e-mail or phone is typed, whether a customer already has it. */
function SameCustomerWatch({
  email,
  phone,
  active,
  onFound,
}: {
  email: string;
  phone: string;
  active: boolean;
  onFound: (c: SameCustomer | null) => void;
}) {
  useEffect(() => {
    if (!active || (email.trim() === '' && phone.trim() === '')) return;
    let live = true;
    const t = setTimeout(() => {
      void findSameCustomer(email, phone)
        .catch(() => null)
        .then((c) => {
          if (live && c) onFound(c);
        });
    }, 500);
    return () => {
      live = false;
      clearTimeout(t);
    };
  }, [email, phone, active, onFound]);
  return null;
}
