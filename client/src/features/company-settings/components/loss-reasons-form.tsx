import { useEffect, useId, useState } from 'react';
import { useFieldArray, useFormContext, useFormState } from 'react-hook-form';
import { useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { LOSS_REASONS_MAX, LOSS_REASONS_MESSAGES, lossReasonListProblems, lossReasonText } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { inputClass } from '../../../components/ui/field-shell';
import { Form } from '../../../components/ui/form';
import { SubmitButton } from '../../../components/ui/form-fields';
import { lossReasonsQueryOptions } from '../../../entities/job/queries';
import { jobKeys } from '../../../entities/job/query-keys';
import { ApiError, isApiError } from '../../../lib/api-error';
import { useSaveLossReasons } from '../api/loss-reasons';

/**
 * The form's values: react-hook-form's field arrays hold objects, so each reason is `{ text }`; the same
 * checks as the server's `lossReasonsInput` (one line, 1–80 characters, at most 20, not the system's reason,
 * not twice), each said beside the reason it is about.
 */
const schema = z.object({
  reasons: z
    .array(z.object({ text: lossReasonText }))
    .min(1, { message: LOSS_REASONS_MESSAGES.none })
    .max(LOSS_REASONS_MAX, { message: LOSS_REASONS_MESSAGES.tooMany })
    .superRefine((list, ctx) => {
      for (const p of lossReasonListProblems(list.map((r) => r.text)))
        ctx.addIssue({ code: 'custom', path: [p.index, 'text'], message: p.message });
    }),
});
type Values = z.input<typeof schema>;

const CONFLICT = 'Someone else saved the list while you were editing. Their list is shown now; make your change again.';

/** The server names a reason as `reasons.N`; the form's field is `reasons.N.text`. */
function onFields(e: ApiError): ApiError {
  return new ApiError({
    status: e.status,
    code: e.code,
    title: e.title,
    detail: e.detail,
    errors: e.errors.map((x) => (/^reasons\.\d+$/.test(x.path) ? { ...x, path: `${x.path}.text` } : x)),
    extra: e.extra,
  });
}

function SaveState({ savedVersion, version }: { savedVersion: number | null; version: number }) {
  const { isDirty, isSubmitting } = useFormState();
  if (isSubmitting) return <p className="text-base text-muted">Saving…</p>;
  if (isDirty) return <p className="text-base font-semibold text-amber-deep">Changes not saved yet.</p>;
  if (savedVersion === version)
    return <Alert tone="ok">Saved. “Mark lost” offers this list, in this order, from now on.</Alert>;
  return null;
}

/** The rows: type to rename, move up or down, remove, add one at the end. */
function ReasonRows() {
  const base = useId();
  const { control, register, getFieldState, formState } = useFormContext<Values>();
  const { fields, append, remove, move } = useFieldArray({ control, name: 'reasons' });
  const [said, setSaid] = useState('');
  const [focusNext, setFocusNext] = useState<string | null>(null);
  // A moved row's button keeps the focus (a row moved in the page can lose it), so moving again is one more press.
  useEffect(() => {
    if (!focusNext) return;
    const el = document.getElementById(focusNext);
    if (el instanceof HTMLButtonElement && !el.disabled) el.focus();
    else document.getElementById(focusNext.replace(/-(up|down)-/, '-input-'))?.focus();
    setFocusNext(null);
  }, [focusNext, fields]);
  const listError = formState.errors.reasons?.root?.message ?? formState.errors.reasons?.message;
  const textOf = (i: number) => {
    const el = document.getElementById(`${base}-input-${fields[i]?.id ?? ''}`);
    return el instanceof HTMLInputElement && el.value.trim() ? `“${el.value.trim()}”` : `Reason ${i + 1}`;
  };
  const shift = (i: number, to: number, dir: 'up' | 'down') => {
    const name = textOf(i);
    const id = fields[i]?.id ?? '';
    move(i, to);
    setSaid(`${name} moved to place ${to + 1} of ${fields.length}.`);
    setFocusNext(`${base}-${dir}-${id}`);
  };
  return (
    <div className="flex flex-col gap-3">
      <ol className="flex flex-col gap-3" aria-label="Loss reasons">
        {fields.map((field, i) => {
          const inputId = `${base}-input-${field.id}`;
          const error = getFieldState(`reasons.${i}.text`, formState).error?.message;
          return (
            <li key={field.id} className="flex flex-col gap-1 rounded-md border border-line p-3">
              <label htmlFor={inputId} className="text-sm font-semibold text-ink-900">
                Reason {i + 1}
              </label>
              <div className="flex flex-col gap-2 sm:flex-row sm:flex-wrap sm:items-center">
                <input
                  id={inputId}
                  className={`${inputClass} sm:flex-1`}
                  autoComplete="off"
                  aria-invalid={error ? true : undefined}
                  aria-describedby={error ? `${inputId}-error` : undefined}
                  {...register(`reasons.${i}.text`)}
                />
                {error ? (
                  <p id={`${inputId}-error`} className="text-sm font-semibold text-danger sm:order-last sm:basis-full">
                    {error}
                  </p>
                ) : null}
                <div className="flex gap-2">
                  <Button
                    id={`${base}-up-${field.id}`}
                    variant="secondary"
                    className="flex-1 sm:flex-none"
                    aria-label={`Move reason ${i + 1} up`}
                    disabled={i === 0}
                    onClick={() => shift(i, i - 1, 'up')}
                  >
                    <span aria-hidden="true">↑</span> Up
                  </Button>
                  <Button
                    id={`${base}-down-${field.id}`}
                    variant="secondary"
                    className="flex-1 sm:flex-none"
                    aria-label={`Move reason ${i + 1} down`}
                    disabled={i === fields.length - 1}
                    onClick={() => shift(i, i + 1, 'down')}
                  >
                    <span aria-hidden="true">↓</span> Down
                  </Button>
                  <Button
                    variant="secondary"
                    className="flex-1 sm:flex-none"
                    aria-label={`Remove reason ${i + 1}`}
                    disabled={fields.length === 1}
                    onClick={() => {
                      const name = textOf(i);
                      remove(i);
                      setSaid(`${name} removed. It is gone once you save.`);
                      const next = fields[i + 1] ?? fields[i - 1];
                      if (next) setFocusNext(`${base}-input-${next.id}`);
                    }}
                  >
                    Remove
                  </Button>
                </div>
              </div>
            </li>
          );
        })}
      </ol>
      {listError ? <p className="text-sm font-semibold text-danger">{listError}</p> : null}
      <p role="status" className="sr-only">
        {said}
      </p>
      <div className="flex flex-col gap-1 sm:flex-row sm:items-center sm:gap-3">
        <Button
          variant="secondary"
          disabled={fields.length >= LOSS_REASONS_MAX}
          onClick={() => {
            append({ text: '' });
            setSaid('');
          }}
        >
          Add a reason
        </Button>
        {fields.length >= LOSS_REASONS_MAX ? (
          <p className="text-sm text-muted">The list holds {LOSS_REASONS_MAX} reasons at most.</p>
        ) : null}
      </div>
    </div>
  );
}

/**
 * The owner's list of reasons a job is marked lost with (GET/PUT /api/company/loss-reasons, If-Match): rename,
 * add, remove, reorder. "Cancelled by buyer" is the system's own, recorded when a buyer cancels a signed
 * proposal; it is shown, never on the list.
 */
export function LossReasonsForm() {
  const list = useSuspenseQuery(lossReasonsQueryOptions()).data;
  const queryClient = useQueryClient();
  const save = useSaveLossReasons();
  const [savedVersion, setSavedVersion] = useState<number | null>(null);
  const [conflict, setConflict] = useState(false);
  return (
    <div className="flex flex-col gap-4">
      <p className="max-w-prose text-base text-ink-950">
        The reasons offered when someone marks a job lost, in this order. A job already marked lost keeps the words it
        was marked with; a change here applies to jobs marked from now on.
        {list.isDefault ? ' This is the starting list; it is yours once you save it.' : ''}
      </p>
      {conflict ? <Alert tone="warning">{CONFLICT}</Alert> : null}
      <Form
        key={list.version}
        aria-label="Loss reasons"
        schema={schema}
        defaultValues={{ reasons: list.reasons.map((text) => ({ text })) }}
        onSubmit={async (values) => {
          setConflict(false);
          try {
            const next = await save.mutateAsync({
              reasons: values.reasons.map((r) => r.text),
              version: list.version,
            });
            setSavedVersion(next.version);
          } catch (e) {
            if (isApiError(e) && e.status === 409) {
              setConflict(true);
              await queryClient.invalidateQueries({ queryKey: jobKeys.lossReasons() });
              return;
            }
            throw isApiError(e) ? onFields(e) : e;
          }
        }}
      >
        <ReasonRows />
        <div className="rounded-md bg-ink-50 p-3 text-base text-ink-950">
          <p className="font-semibold">{list.systemReason}</p>
          <p className="text-sm text-muted">
            Recorded by the system when a buyer cancels a signed proposal within the right-to-cancel window. It is not
            on this list and cannot be renamed or removed, so reports tell a cancellation from a lost sale.
          </p>
        </div>
        <div className="flex flex-col gap-3 sm:flex-row sm:items-center">
          <SubmitButton>Save the list</SubmitButton>
          <SaveState savedVersion={savedVersion} version={list.version} />
        </div>
      </Form>
    </div>
  );
}
