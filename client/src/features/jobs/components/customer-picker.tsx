import { useState } from 'react';
import { useFormContext } from 'react-hook-form';
import type { CustomerRecord } from '@contract';
import { useCustomers } from '../api/get-customers';

/** Search the company's customers and pick one (sets the form's customerId; `onPick` fills the site). */
export function CustomerPicker({
  initialSearch = '',
  onPick,
}: {
  initialSearch?: string;
  onPick?: (customer: CustomerRecord) => void;
}) {
  const { setValue, watch, getFieldState, formState } = useFormContext();
  const [search, setSearch] = useState(initialSearch);
  const customers = useCustomers(search.trim(), true);
  const chosen: unknown = watch('customerId');
  const error = getFieldState('customerId', formState).error?.message;
  return (
    <div className="flex flex-col gap-2">
      <label htmlFor="customer-search" className="text-sm font-semibold text-ink-900">
        Find a customer
      </label>
      <input
        id="customer-search"
        type="search"
        className="block min-h-touch w-full rounded-md border border-line bg-white px-3 text-base"
        value={search}
        onChange={(e) => setSearch(e.target.value)}
        placeholder="Name, e-mail or phone"
      />
      {error ? <p className="text-sm font-semibold text-danger">{error}</p> : null}
      <ul aria-label="Matching customers" className="flex max-h-64 flex-col gap-1 overflow-y-auto">
        {(customers.data ?? []).map((c) => (
          <li key={c.id}>
            <label className="flex min-h-touch cursor-pointer items-center gap-3 rounded-md border border-line bg-white px-3 has-[:checked]:border-ink-800 has-[:checked]:bg-ink-50">
              <input
                type="radio"
                name="customer-choice"
                className="size-5"
                checked={chosen === c.id}
                onChange={() => {
                  setValue('customerId', c.id, { shouldValidate: true });
                  onPick?.(c);
                }}
              />
              <span>
                <span className="block font-semibold">{c.name}</span>
                <span className="block text-sm text-muted">{[c.email, c.phone].filter(Boolean).join(' · ')}</span>
              </span>
            </label>
          </li>
        ))}
      </ul>
      {customers.isSuccess && customers.data.length === 0 ? (
        <p className="text-sm text-muted">No customer matches. Switch to “New customer”.</p>
      ) : null}
    </div>
  );
}
