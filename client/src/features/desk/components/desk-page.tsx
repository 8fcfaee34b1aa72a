import { useSuspenseQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { z } from 'zod';
import { formatMoney } from '@calc';
import { MAX_OPTIONS, mayEditOptions, mayMarkReady, type BlockerRecord } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Button, buttonClass } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { PageHeader } from '../../../components/ui/page-header';
import { jobPaths } from '../../../entities/job/paths';
import { jobQueryOptions, roomsQueryOptions } from '../../../entities/job/queries';
import { errorMessage } from '../../../lib/api-error';
import { useViewer } from '../../../lib/viewer';
import { useCreateOption } from '../api/create-option';
import { deskQueryOptions } from '../api/get-desk';
import { modelsQueryOptions } from '../api/get-models';
import { useSetReady } from '../api/set-ready';
import { SizingOverride } from './sizing-override';
import { CompareOptions } from './compare-options';
import { DeskFold } from './desk-fold';
import { OptionView } from './option-view';

export const deskParams = z.object({ jobId: z.uuid({ message: 'That is not a job address.' }) });

function NewOption({ jobId, count, onCreated }: { jobId: string; count: number; onCreated: (id: string) => void }) {
  const create = useCreateOption(jobId);
  const [name, setName] = useState('');
  if (count >= MAX_OPTIONS) return null;
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        // The new option opens at once: it is what the person is about to design.
        create.mutate(
          { name: name.trim() },
          {
            onSuccess: (option) => {
              setName('');
              onCreated(option.id);
            },
          },
        );
      }}
    >
      <label className="flex flex-col gap-1 text-sm font-semibold text-ink-900">
        New option name
        <input
          className="min-h-touch rounded-md border border-line bg-white px-3 text-base font-normal"
          value={name}
          placeholder="e.g. Quiet comfort"
          onChange={(e) => setName(e.target.value)}
        />
      </label>
      <Button type="submit" variant="secondary" busy={create.isPending}>
        Add option
      </Button>
      {create.isError ? <p className="w-full text-sm text-danger">{errorMessage(create.error)}</p> : null}
    </form>
  );
}

const blockerKey = (b: BlockerRecord) => `${b.code}:${b.optionId ?? ''}:${b.message}`;

/**
 * What stops "ready to propose". Units outside their sizing range (each also said beside its unit) fold on a
 * phone to one line that counts them per option; everything else stays listed in full.
 */
function Blockers({
  blockers,
  options,
}: {
  blockers: readonly BlockerRecord[];
  options: readonly { id: string; name: string }[];
}) {
  if (blockers.length === 0) return null;
  const sizing = blockers.filter((b) => b.code === 'sizing-outside-range');
  const rest = blockers.filter((b) => b.code !== 'sizing-outside-range');
  const perOption = options
    .map((o) => ({ name: o.name, n: sizing.filter((b) => b.optionId === o.id).length }))
    .filter((x) => x.n > 0)
    .map((x) => `${x.name} ${x.n}`)
    .join(', ');
  const list = (bs: readonly BlockerRecord[]) => (
    <ul className="w-full list-disc pl-5 text-sm text-amber-deep">
      {bs.map((b) => (
        <li key={blockerKey(b)}>{b.message}</li>
      ))}
    </ul>
  );
  return (
    <>
      {rest.length > 0 ? list(rest) : null}
      {sizing.length > 0 ? (
        <DeskFold
          className="w-full"
          summary={
            <span className="font-semibold text-amber-deep">
              {sizing.length === 1 ? '1 unit' : `${sizing.length} units`} sized outside the allowed range
              {perOption ? ` (${perOption})` : ''}
            </span>
          }
        >
          {list(sizing)}
        </DeskFold>
      ) : null}
    </>
  );
}

/** /jobs/:jobId/desk — the estimator's desk: up to three options as tabs, each worked out by the server with calc. */
export function DeskPage() {
  const { jobId } = deskParams.parse(useParams());
  const viewer = useViewer();
  const job = useSuspenseQuery(jobQueryOptions(jobId)).data;
  const rooms = useSuspenseQuery(roomsQueryOptions(jobId)).data;
  const desk = useSuspenseQuery(deskQueryOptions(jobId)).data;
  const models = useSuspenseQuery(modelsQueryOptions()).data;
  const ready = useSetReady(jobId);
  const [picked, setPicked] = useState<string | null>(null);
  const current = desk.options.find((o) => o.id === picked) ?? desk.options[0] ?? null;
  if (!viewer) return null;
  const r = desk.readiness;
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title={`Estimator’s desk — ${job.customer.name}`}
        lead={[job.site.street, job.site.city].filter(Boolean).join(', ')}
        actions={
          <Link className={buttonClass('secondary')} to={jobPaths.walkthrough(jobId)}>
            Back to the walk-through
          </Link>
        }
      />
      <section
        aria-label="Ready to propose"
        className="flex flex-wrap items-center gap-3 rounded-lg border border-line bg-white p-4"
      >
        <p className={`font-semibold ${r.ready ? 'text-ok' : 'text-ink-900'}`}>
          {r.markedReady
            ? r.ready
              ? `Ready to propose — marked by ${r.markedReady.by.name}.`
              : `Marked ready by ${r.markedReady.by.name}, but something blocks it now.`
            : 'Not marked ready to propose.'}
        </p>
        {mayMarkReady(viewer.role) ? (
          <Button
            variant={r.markedReady ? 'secondary' : 'primary'}
            busy={ready.isPending}
            onClick={() => ready.mutate(!r.markedReady)}
          >
            {r.markedReady ? 'Take the ready mark off' : 'Mark ready to propose'}
          </Button>
        ) : null}
        {r.ready || job.hasProposal ? (
          <Link
            // Ready (a first proposal, or a revision after a change): the proposal screen is the next step.
            className={buttonClass(r.ready ? 'primary' : 'secondary')}
            to={jobPaths.proposal(jobId)}
          >
            {job.hasProposal ? 'The proposal' : 'Go to the proposal'}
          </Link>
        ) : null}
        <Blockers blockers={r.blockers} options={desk.options} />
        {ready.isError ? (
          <Alert tone="danger" title="Not marked ready">
            {errorMessage(ready.error)}
          </Alert>
        ) : null}
        {mayMarkReady(viewer.role) ? (
          <SizingOverride
            readiness={r}
            error={ready.error}
            busy={ready.isPending}
            onMark={(reason) => ready.mutate({ reason })}
          />
        ) : null}
      </section>

      {desk.options.length === 0 ? (
        <EmptyState title="No options yet">Name the first option (for example “Essential”) and design it.</EmptyState>
      ) : (
        <div role="tablist" aria-label="Options" className="flex flex-wrap gap-2 border-b border-line">
          {desk.options.map((o) => (
            <button
              key={o.id}
              role="tab"
              type="button"
              aria-selected={o.id === current?.id}
              className={`min-h-touch rounded-t-md px-4 font-semibold ${
                o.id === current?.id ? 'border-b-4 border-amber bg-white text-ink-900' : 'text-muted'
              }`}
              onClick={() => setPicked(o.id)}
            >
              {o.name}
              {o.result?.price ? ` · ${formatMoney(o.result.price.totalCents, { whole: true })}` : ''}
            </button>
          ))}
        </div>
      )}
      {mayEditOptions(viewer.role) ? (
        <NewOption jobId={jobId} count={desk.options.length} onCreated={setPicked} />
      ) : null}
      {current ? (
        <div role="tabpanel" aria-label={current.name}>
          <OptionView
            key={current.id}
            jobId={jobId}
            option={current}
            count={desk.options.length}
            rooms={rooms}
            models={models}
            viewer={viewer}
          />
        </div>
      ) : null}
      <CompareOptions options={desk.options} models={models} />
    </div>
  );
}
