import { TextField } from '../../../components/ui/form-fields';

/** The job's site and notes, as the new-job form and the job details both ask for them (field names: siteRules). */
export function SiteFields({ legendClass }: { legendClass: string }) {
  return (
    <fieldset className="grid gap-4 sm:grid-cols-2">
      <legend className={legendClass}>Site</legend>
      <TextField name="street" label="Street address" autoComplete="off" />
      <TextField name="unit" label="Unit or apartment" autoComplete="off" />
      <TextField name="city" label="City or town" autoComplete="off" />
      <TextField name="region" label="State or region" autoComplete="off" />
      <TextField name="postalCode" label="Postal code" autoComplete="off" />
      <TextField name="notes" label="Job notes" autoComplete="off" />
    </fieldset>
  );
}
