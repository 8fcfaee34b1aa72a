import { useState } from 'react';
import type { ReadinessRecord } from '@contract';
import { Button } from '../../../components/ui/button';
import { FieldShell, inputClass } from '../../../components/ui/field-shell';
import { isApiError } from '../../../lib/api-error';

/**
 * Beside the refusal: when only units outside their sizing range hold the ready mark, the office may
 * mark the job ready anyway by saying why these sizes are right for this home (kept with the mark).
 */
export function SizingOverride({
  readiness,
  error,
  busy,
  onMark,
}: {
  readiness: ReadinessRecord;
  error: unknown;
  busy: boolean;
  onMark: (reason: string) => void;
}) {
  const [reason, setReason] = useState('');
  const o = readiness.sizingOverride;
  if (o)
    return (
      <p className="w-full text-sm text-ink-900">
        Sizes outside the range proposed anyway by {o.by.name} on {o.at.slice(0, 10)}: “{o.reason}”
      </p>
    );
  const sizing = readiness.blockers.filter((b) => b.code === 'sizing-outside-range');
  if (readiness.markedReady || sizing.length === 0 || sizing.length !== readiness.blockers.length) return null;
  const fieldError = isApiError(error) ? error.errors.find((e) => e.path === 'sizingOverride.reason') : undefined;
  return (
    <form
      className="flex w-full flex-col gap-2 sm:flex-row sm:items-start"
      onSubmit={(e) => {
        e.preventDefault();
        onMark(reason);
      }}
    >
      <div className="min-w-0 flex-1">
        <FieldShell
          id="sizing-override-reason"
          label="Why these sizes are right for this home"
          hint="Kept with the ready mark, with your name and the date."
          error={fieldError?.message}
        >
          <input
            id="sizing-override-reason"
            className={inputClass}
            value={reason}
            maxLength={500}
            aria-invalid={fieldError ? true : undefined}
            aria-describedby={fieldError ? 'sizing-override-reason-error' : 'sizing-override-reason-hint'}
            onChange={(e) => setReason(e.target.value)}
          />
        </FieldShell>
      </div>
      <Button type="submit" variant="secondary" busy={busy} className="sm:mt-6">
        Mark ready with this reason
      </Button>
    </form>
  );
}
