import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import {
  maySeeCost,
  mayEditOptions,
  mayEditTakeoff,
  mayDecideDiscount,
  type OptionRecord,
  type RoomRecord,
} from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { errorMessage } from '../../../lib/api-error';
import type { Viewer } from '../../../lib/viewer';
import { useCreateOption } from '../api/create-option';
import { useDeleteOption } from '../api/delete-option';
import { financingQueryOptions } from '../api/get-financing';
import type { DeskModel } from '../api/get-models';
import { explanationView, viewOf, type ExplanationView } from '../model/result-view';
import { Cautions } from './cautions';
import { DesignForm } from './design-form';
import { FirstPriceReview } from './first-price-review';
import { PricePanel } from './price-panel';
import { PricingForm } from './pricing-form';
import { DeskFold } from './desk-fold';
import { SystemResults } from './system-results';
import { UnitWhys } from './unit-whys';
import { TakeoffTable } from './takeoff-table';
import { useSuggest } from '../api/suggest';
import { useUpdateOption } from '../api/update-option';
import { designSchema } from '@calc';
import { usePhone } from '../../../lib/use-phone';
import { Why } from './why';

/** Every why the server sent for this option, by key (calc's explanations; a shape calc changes is left out). */
function whysOf(option: OptionRecord): Map<string, ExplanationView> {
  const out = new Map<string, ExplanationView>();
  const raw: unknown = option.result ? Reflect.get(option.result, 'explanations') : undefined;
  if (Array.isArray(raw))
    for (const r of raw) {
      const p = explanationView.safeParse(r);
      if (p.success) out.set(p.data.key, p.data);
    }
  return out;
}

/**
 * One card of the desk. With `fold`, a phone shows its heading and one line saying what is inside (the form
 * stays mounted while folded, so nothing typed is lost); a wider screen starts with it open.
 */
function Card({
  title,
  fold,
  children,
}: {
  title: string;
  fold?: { summary: string; startOpen?: boolean };
  children: React.ReactNode;
}) {
  return (
    <section aria-label={title} className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4">
      <h3 className="text-lg font-semibold text-ink-900">{title}</h3>
      {fold ? (
        <DeskFold keepMounted startOpen={fold.startOpen} summary={<span className="text-ink-700">{fold.summary}</span>}>
          <div className="flex flex-col gap-3 pt-2">{children}</div>
        </DeskFold>
      ) : (
        children
      )}
    </section>
  );
}

/** The design in one line, for the folded card on a phone: "3 zones on 1 outdoor unit (TSL-M24-3P)". */
function designSummary(option: OptionRecord): string {
  const d = designSchema.safeParse(option.design);
  if (!d.success || d.data.zones.length === 0) return 'Not designed yet';
  const zones = d.data.zones.length;
  const systems = d.data.systems.map((s) => s.outdoorUnitKey);
  const units = systems.length === 1 ? '1 outdoor unit' : `${systems.length} outdoor units`;
  // "2 × TSL-S9H-O" rather than the same model named twice.
  const models = [...new Set(systems)].map((k) => {
    const n = systems.filter((x) => x === k).length;
    return n > 1 ? `${n} × ${k}` : k;
  });
  return `${zones} ${zones === 1 ? 'zone' : 'zones'} on ${units}${models.length > 0 ? ` (${models.join(', ')})` : ''} — open to change`;
}

/** One option: its design on the left, what calc made of it on the right (sizing, lines, charge, electrical, takeoff, price). */
export function OptionView({
  jobId,
  option,
  count,
  rooms,
  models,
  viewer,
}: {
  jobId: string;
  option: OptionRecord;
  count: number;
  rooms: readonly RoomRecord[];
  models: readonly DeskModel[];
  viewer: Viewer;
}) {
  const canEdit = mayEditOptions(viewer.role);
  const office = maySeeCost(viewer.role);
  const plans = useQuery({ ...financingQueryOptions(), enabled: office }).data ?? [];
  const copy = useCreateOption(jobId);
  const remove = useDeleteOption(jobId);
  const [copyName, setCopyName] = useState(`${option.name} (copy)`);
  const suggest = useSuggest(jobId);
  const update = useUpdateOption(jobId);
  const [revision, setRevision] = useState(0);
  const [reasons, setReasons] = useState<ExplanationView[]>([]);
  const handleSuggest = async () => {
    const stored = designSchema.safeParse(option.design);
    const s = await suggest.mutateAsync(stored.success ? stored.data : undefined);
    await update.mutateAsync({ option, changes: { design: s.design } });
    setReasons(
      s.reasons.flatMap((r) => {
        const p = explanationView.safeParse(r);
        return p.success ? [p.data] : [];
      }),
    );
    setRevision((n) => n + 1);
  };
  const view = option.result ? viewOf(option.result) : null;
  const whys = whysOf(option);
  const phone = usePhone();
  // The systems' own whys (backup heat, duct loads), for the design form to show beside the heat kit.
  const systemWhys = new Map((view?.systems ?? []).flatMap((s) => s.explanations.map((x) => [x.key, x] as const)));
  const besideNumbers = new Set(
    (view?.systems ?? []).flatMap((s) => [
      ...(s.refrigerant?.cautions ?? []),
      ...(s.electrical?.caution ? [s.electrical.caution] : []),
    ]),
  );
  // The outdoor unit a zone's indoor unit is alone on (a one-to-one pair), if any.
  const pairOf = (zoneKey: string) => {
    const s = view?.systems.find(
      (x) => x.refrigerant?.circuits.length === 1 && x.refrigerant.circuits[0]?.zoneKey === zoneKey,
    );
    return s ? { name: s.name, whys: s.explanations } : undefined;
  };
  const generalCautions = (option.result?.cautions ?? []).filter((c) => !besideNumbers.has(c));
  const forms = (
    <div key="forms" className="flex min-w-0 flex-col gap-4">
      <Card
        title="Design"
        fold={{ summary: designSummary(option), startOpen: !phone || !option.result || option.problems.length > 0 }}
      >
        {canEdit ? (
          <div className="flex flex-col gap-2">
            <div className="flex flex-wrap items-center gap-2">
              <Button
                variant="secondary"
                busy={suggest.isPending || update.isPending}
                onClick={() => void handleSuggest().catch(() => undefined)}
              >
                Suggest units from the catalog
              </Button>
              <span className="text-sm text-muted">Replaces this option’s units; you can change anything after.</span>
            </div>
            {suggest.isError || update.isError ? (
              <p role="alert" className="text-sm font-semibold text-danger">
                {errorMessage(suggest.error ?? update.error)}
              </p>
            ) : null}
            {reasons.length > 0 ? (
              <details className="rounded-md border border-line p-2">
                <summary className="min-h-touch cursor-pointer font-semibold">Why these units</summary>
                <div className="mt-2 flex flex-col gap-1">
                  {reasons.map((r) => (
                    <Why key={r.key} e={r} />
                  ))}
                </div>
              </details>
            ) : null}
          </div>
        ) : null}
        <DesignForm
          key={`${option.id}:${revision}`}
          jobId={jobId}
          option={option}
          rooms={rooms}
          models={models}
          canEdit={canEdit}
          whys={systemWhys}
        />
      </Card>
      {office ? (
        <Card title="Pricing" fold={{ summary: 'Discounts, deposit, tax and financing — open to change' }}>
          <PricingForm key={option.id} jobId={jobId} option={option} plans={plans} />
        </Card>
      ) : null}
      {canEdit ? (
        <Card title="Copy or delete" fold={{ summary: `Copy “${option.name}” to start the next option, or delete it` }}>
          <div className="flex flex-wrap items-end gap-2">
            <label className="flex flex-col gap-1 text-sm font-semibold">
              Name of the copy
              <input
                className="min-h-touch rounded-md border border-line px-3 text-base font-normal"
                value={copyName}
                onChange={(e) => setCopyName(e.target.value)}
              />
            </label>
            <Button
              variant="secondary"
              busy={copy.isPending}
              disabled={count >= 3}
              onClick={() => copy.mutate({ name: copyName, copyFromOptionId: option.id })}
            >
              Copy this option
            </Button>
            <Button
              variant="danger"
              busy={remove.isPending}
              onClick={() => {
                if (window.confirm(`Delete the option “${option.name}”?`)) remove.mutate(option);
              }}
            >
              Delete option
            </Button>
          </div>
          {count >= 3 ? <p className="text-sm text-muted">A job holds at most three options.</p> : null}
          {copy.isError ? <p className="text-sm text-danger">{errorMessage(copy.error)}</p> : null}
          {remove.isError ? <p className="text-sm text-danger">{errorMessage(remove.error)}</p> : null}
        </Card>
      ) : null}
    </div>
  );
  const results = (
    <div key="results" className="flex min-w-0 flex-col gap-4">
      {option.result?.price ? (
        <Card title="Price">
          <PricePanel jobId={jobId} option={option} whys={whys} owner={mayDecideDiscount(viewer.role)} />
        </Card>
      ) : null}
      {view ? (
        <Card title="Equipment, lines and charge, electrical">
          {view.zones.map((z) => (
            <div key={z.zoneKey} className="flex flex-col gap-1">
              <h4 className="font-semibold text-ink-900">
                {z.name}: {z.indoorUnitKey}
              </h4>
              <UnitWhys whys={z.explanations} sizing={z.sizing} name={z.name} pairedWith={pairOf(z.zoneKey)} />
            </div>
          ))}
          {view.systems.map((s) => (
            <SystemResults key={s.systemKey} system={s} zones={view.zones} models={models} />
          ))}
          {option.result && option.result.discontinued.length > 0 ? (
            <p className="text-sm text-amber-deep">
              Discontinued: {option.result.discontinued.map((d) => `${d.key} (${d.name})`).join(', ')}
            </p>
          ) : null}
          {/* Each system's refrigerant and electrical cautions stand beside its numbers above; here the rest. */}
          <Cautions title="Before installing" items={generalCautions} />
        </Card>
      ) : null}
      {option.result ? (
        <Card title="Materials and labor">
          <TakeoffTable
            jobId={jobId}
            option={option}
            lines={option.result.takeoff}
            whys={whys}
            canEdit={mayEditTakeoff(viewer.role)}
          />
        </Card>
      ) : null}
    </div>
  );
  return (
    <div className="flex flex-col gap-4">
      <FirstPriceReview jobId={jobId} option={option} viewer={viewer} />
      {option.problems.length > 0 ? (
        <Alert tone="danger" title="This option cannot be worked out yet">
          <ul className="list-disc pl-5">
            {option.problems.map((p) => (
              <li key={`${p.path}:${p.message}`}>{p.message}</li>
            ))}
          </ul>
        </Alert>
      ) : null}
      {/* minmax(0, …) tracks: a select's longest model name must not widen the page on a phone. On a phone the
          results come first (the price and the verdicts), in the reading and tab order too, and the forms fold. */}
      <div className="grid grid-cols-[minmax(0,1fr)] gap-4 xl:grid-cols-[minmax(0,5fr)_minmax(0,4fr)]">
        {phone ? results : forms}
        {phone ? forms : results}
      </div>
    </div>
  );
}
