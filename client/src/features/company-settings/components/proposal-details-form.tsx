import { useState } from 'react';
import { useFormState } from 'react-hook-form';
import { useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import { ADDRESS_LINES_MAX, proposalDetailsBody, PROPOSAL_TEXT_MAX } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { SubmitButton, TextField } from '../../../components/ui/form-fields';
import { isApiError } from '../../../lib/api-error';
import { proposalDetailsKey, proposalDetailsQueryOptions, useSaveProposalDetails } from '../api/proposal-details';
import { LongTextField } from './long-text-field';

const CONFLICT =
  'Someone else saved these proposal details while you were editing. Their values are shown now; make your change again.';
const LIMIT = `Up to ${PROPOSAL_TEXT_MAX.toLocaleString('en-US')} characters; a blank line starts a new paragraph.`;

function SaveState({ savedVersion, version }: { savedVersion: number | null; version: number }) {
  const { isDirty, isSubmitting } = useFormState();
  if (isSubmitting) return <p className="text-base text-muted">Saving…</p>;
  if (isDirty) return <p className="text-base font-semibold text-amber-deep">Changes not saved yet.</p>;
  if (savedVersion === version)
    return <Alert tone="ok">Saved. Proposals issued from now on carry these details.</Alert>;
  return null;
}

/**
 * The owner's details for every proposal: contact lines and licence for the cover, the address the buyer's
 * notice of cancellation names, terms, warranty, and what a state's law adds to the federal notice. Issuing a
 * version freezes them; a later change alters only versions issued after it.
 */
export function ProposalDetailsForm() {
  const details = useSuspenseQuery(proposalDetailsQueryOptions()).data;
  const queryClient = useQueryClient();
  const save = useSaveProposalDetails();
  const [savedVersion, setSavedVersion] = useState<number | null>(null);
  const [conflict, setConflict] = useState(false);
  return (
    <div className="flex flex-col gap-4">
      {details.address.trim() === '' ? (
        <Alert tone="warning">
          Add the company’s address: the buyer’s notice of cancellation must name it (FTC Cooling-Off Rule, 16 CFR
          429.1). Until then the notice prints a blank line for it.
        </Alert>
      ) : null}
      {conflict ? <Alert tone="warning">{CONFLICT}</Alert> : null}
      <Form
        key={details.version}
        aria-label="Proposal details"
        schema={proposalDetailsBody}
        defaultValues={{
          address: details.address,
          phone: details.phone,
          email: details.email,
          licence: details.licence,
          terms: details.terms,
          warranty: details.warranty,
          cancellationExtra: details.cancellationExtra,
        }}
        onSubmit={async (body) => {
          setConflict(false);
          try {
            const next = await save.mutateAsync({ body, version: details.version });
            setSavedVersion(next?.version ?? null);
          } catch (e) {
            if (isApiError(e) && e.status === 409) {
              setConflict(true);
              await queryClient.invalidateQueries({ queryKey: proposalDetailsKey() });
              return;
            }
            throw e;
          }
        }}
      >
        <fieldset className="flex flex-col gap-4 rounded-md border border-line p-4">
          <legend className="px-1 text-base font-semibold text-ink-900">How customers reach you</legend>
          <div className="grid gap-4 md:grid-cols-2">
            <LongTextField
              name="address"
              label="Business address"
              rows={3}
              autoComplete="street-address"
              hint={`Up to ${ADDRESS_LINES_MAX} lines. On the cover, and the address a buyer sends a cancellation to.`}
            />
            <div className="flex flex-col gap-4">
              <TextField name="phone" label="Phone" type="tel" autoComplete="tel" inputMode="tel" />
              <TextField name="email" label="E-mail" type="email" autoComplete="email" inputMode="email" />
            </div>
          </div>
          <TextField
            name="licence"
            label="Licence line"
            hint="One line under your contact details, for example the contractor licence number your state gives."
          />
        </fieldset>
        <fieldset className="flex flex-col gap-4 rounded-md border border-line p-4">
          <legend className="px-1 text-base font-semibold text-ink-900">Terms and warranty</legend>
          <LongTextField name="terms" label="Terms" rows={6} hint={LIMIT} />
          <LongTextField name="warranty" label="Warranty" rows={5} hint={LIMIT} />
        </fieldset>
        <fieldset className="flex flex-col gap-4 rounded-md border border-line p-4">
          <legend className="px-1 text-base font-semibold text-ink-900">Right to cancel</legend>
          <p className="-mt-2 text-sm text-muted">
            Every proposal carries the buyer’s federal notice of the right to cancel within three business days and its
            cancellation form (16 CFR 429.1). Their wording is fixed by the rule.
          </p>
          <LongTextField
            name="cancellationExtra"
            label="Extra cancellation wording your state requires"
            rows={4}
            hint="Only what your state’s law adds. It prints after the federal form, as you write it. Leave empty if your state adds nothing."
          />
        </fieldset>
        <div className="flex flex-col gap-3 sm:flex-row sm:items-center">
          <SubmitButton>Save proposal details</SubmitButton>
          <SaveState savedVersion={savedVersion} version={details.version} />
        </div>
      </Form>
    </div>
  );
}
