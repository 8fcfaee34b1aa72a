import { useQuery, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import { useCallback, useEffect, useRef, useState, type ReactNode } from 'react';
import {
  ADDITIVE_CAUTION,
  type CommissioningPatch,
  type CommissioningRecord,
  type RefrigerantEntryInput,
} from '@contract';
import { evacuationReading, recomputedExtraCharge, standingTestReading } from '@calc';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { FieldShell, inputClass } from '../../../components/ui/field-shell';
import { PageHeader } from '../../../components/ui/page-header';
import { Spinner } from '../../../components/ui/spinner';
import { isApiError } from '../../../lib/api-error';
import { diffFields, mergeChoices } from '../../../lib/offline/conflict';
import { ConflictChoices } from '../../../lib/offline/conflict-choices';
import { OfflineNotice } from '../../../lib/offline/offline-notice';
import { useOnline } from '../../../lib/offline/online';
import { SaveStatusPill, saveStatus } from '../../../lib/offline/save-status-pill';
import { useTypingCount } from '../../../lib/offline/typing';
import { markUnsavedFields, useUnsavedFieldCount } from '../../../lib/offline/unsaved-fields';
import { useDebouncedSave } from '../../../lib/offline/use-debounced-save';
import { useViewer } from '../../../lib/viewer';
import { addAmendment, commissioningKeys, recordQueryOptions, saveCertNumber, signOff } from '../api/record';
import { checkStep, partsOf, STEP_LABELS, type Parts, type StepKey } from '../model/check';
import { pendingEntries, pendingPatch, recordTarget, entryTarget } from '../sync/edits';
import { useCommissioningQueue, type CommissioningQueue } from '../sync/commissioning-queue';
import { Cautions, NumberBox, TextBox, Verdict } from './fields';

/** What the route composes in: the drawing box of the signing piece (features stay apart). */
export type SignatureBox = (props: { id: string; onChange: (dataUrl: string | null) => void }) => ReactNode;

/**
 * /jobs/:jobId/commissioning — the installer's record on site, on the offline kit as the walk-through uses it:
 * each step saves as entered into the person's queue (kept on the phone, sent when there is signal), the pill
 * says the true state, calc's verdicts show beside each step from what is entered (no signal needed), and the
 * sign-off (installer + customer's acknowledgement) goes when everything has reached the office.
 */
export function CommissioningPage({ jobId, signatureBox }: { jobId: string; signatureBox: SignatureBox }) {
  const viewer = useViewer();
  if (!viewer) return null;
  if (viewer.role === 'salesperson')
    return (
      <Alert tone="warning" title="The commissioning record is the installer’s and the office’s.">
        Ask the office for a copy once the job is installed.
      </Alert>
    );
  return <Screen jobId={jobId} signatureBox={signatureBox} />;
}

function Screen({ jobId, signatureBox }: { jobId: string; signatureBox: SignatureBox }) {
  const query = useSuspenseQuery(recordQueryOptions(jobId));
  const record = query.data;
  const { queue, state } = useCommissioningQueue();
  const typing = useTypingCount();
  const invalid = useUnsavedFieldCount();
  const mine = state.items.filter((i) => i.payload.jobId === jobId);
  if (!state.loaded) return <Spinner label="Opening what this phone holds…" />;
  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-5 pb-16">
      <PageHeader
        title="Commissioning record"
        lead={record.systems.map((s) => `${s.name} · ${s.outdoorModel} · ${s.refrigerant}`).join(' — ') || undefined}
      />
      <div className="sticky top-0 z-10 -mx-2 flex flex-wrap items-center gap-2 bg-white/95 px-2 py-2">
        <SaveStatusPill status={saveStatus(state, typing, 0, invalid)} />
        {record.state === 'installed' ? (
          <span className="rounded-full border border-ok bg-ok-soft px-3 py-1 text-sm font-semibold text-ok">
            Installed — read-only
          </span>
        ) : null}
      </div>
      <OfflineNotice updatedAt={query.dataUpdatedAt} waiting={mine.length} />
      {state.blocked ? (
        <Alert tone="danger" title="Not sent yet">
          {state.blocked}
        </Alert>
      ) : null}
      {state.rejected ? (
        <Alert tone="danger" title="The office refused a change">
          <p>{state.rejected}</p>
          <Button variant="secondary" onClick={() => queue.dismissRejected()}>
            Understood
          </Button>
        </Alert>
      ) : null}
      {state.conflict && state.conflict.payload.jobId === jobId && state.conflict.payload.kind === 'record-patch' ? (
        <ConflictPanel jobId={jobId} queue={queue} />
      ) : (
        <Steps key={record.state} jobId={jobId} record={record} queue={queue} signatureBox={signatureBox} />
      )}
    </div>
  );
}

function Steps({
  jobId,
  record,
  queue,
  signatureBox,
}: {
  jobId: string;
  record: CommissioningRecord;
  queue: CommissioningQueue;
  signatureBox: SignatureBox;
}) {
  const { state } = useCommissioningQueue();
  const readOnly = record.state === 'installed';
  // What this phone has: the server's record with every step still waiting laid over it (survives a reload).
  const [draft, setDraft] = useState<Parts>(() => ({ ...partsOf(record), ...pendingPatch(state.items, jobId) }));
  const versionRef = useRef(record.version);
  versionRef.current = record.version;
  const enqueue = useCallback(
    (patch: CommissioningPatch) =>
      void queue.enqueue({
        target: recordTarget(jobId),
        baseVersion: versionRef.current,
        payload: { kind: 'record-patch', jobId, patch },
      }),
    [jobId, queue],
  );
  const change = useStepChange(jobId, record.testPressureLimitPsig, enqueue, setDraft);
  const entries = [
    ...record.refrigerant.map((e) => ({ ...e, waiting: false })),
    ...pendingEntries(state.items, jobId)
      .filter((p) => !record.refrigerant.some((e) => e.id === p.id))
      .map((e) => ({ ...e, technicianName: 'You', enteredAt: '', waiting: true })),
  ];
  return (
    <>
      {readOnly ? <Installed jobId={jobId} record={record} /> : null}
      <fieldset disabled={readOnly} className="contents">
        <Cautions items={record.cautions.filter((c) => !/nitrogen|additive/i.test(c))} />
        <PressureStep record={record} draft={draft} change={change} />
        <LeaksStep draft={draft} change={change} />
        <EvacuationStep record={record} draft={draft} change={change} />
        <RefrigerantStep
          jobId={jobId}
          record={record}
          draft={draft}
          change={change}
          entries={entries}
          queue={queue}
          readOnly={readOnly}
        />
        <StartupStep record={record} draft={draft} change={change} />
        <Card title="Notes">
          <TextBox
            label="Notes for the record"
            multiline
            value={draft.notes}
            error={change.errors.notes?.['']}
            onValue={(v) => change.set('notes', v)}
          />
        </Card>
      </fieldset>
      {readOnly ? null : (
        <SignOff jobId={jobId} record={record} waiting={state.items.length} signatureBox={signatureBox} />
      )}
    </>
  );
}

interface StepChange {
  set: <K extends StepKey>(key: K, value: Parts[K], bad?: number) => void;
  errors: Partial<Record<StepKey, Record<string, string>>>;
}

/** Each step: checked with the contract's rules as typed; sent (debounced) only when it passes, else shown beside the field. */
function useStepChange(
  jobId: string,
  limit: number | null,
  enqueue: (p: CommissioningPatch) => void,
  setDraft: (f: (d: Parts) => Parts) => void,
): StepChange {
  const [errors, setErrors] = useState<StepChange['errors']>({});
  const saves = {
    pressureTest: useDebouncedSave<Parts['pressureTest']>(`commissioning:${jobId}:pressureTest`, (v) =>
      enqueue({ pressureTest: v }),
    ),
    leaks: useDebouncedSave<Parts['leaks']>(`commissioning:${jobId}:leaks`, (v) => enqueue({ leaks: v })),
    evacuation: useDebouncedSave<Parts['evacuation']>(`commissioning:${jobId}:evacuation`, (v) =>
      enqueue({ evacuation: v }),
    ),
    measuredLines: useDebouncedSave<Parts['measuredLines']>(`commissioning:${jobId}:measuredLines`, (v) =>
      enqueue({ measuredLines: v }),
    ),
    startup: useDebouncedSave<Parts['startup']>(`commissioning:${jobId}:startup`, (v) => enqueue({ startup: v })),
    notes: useDebouncedSave<Parts['notes']>(`commissioning:${jobId}:notes`, (v) => enqueue({ notes: v })),
  };
  useEffect(
    () => () => {
      for (const k of Object.keys(STEP_LABELS)) markUnsavedFields(`commissioning:${k}`, 0);
    },
    [],
  );
  const set = <K extends StepKey>(key: K, value: Parts[K], bad = 0) => {
    setDraft((d) => ({ ...d, [key]: value }));
    const found = checkStep(key, value, limit);
    setErrors((e) => ({ ...e, [key]: key === 'notes' && found[''] === undefined ? {} : found }));
    const count = Object.keys(found).length + bad;
    markUnsavedFields(`commissioning:${key}`, count);
    const save = saves[key] as { schedule: (v: Parts[K]) => void; cancel: () => void };
    if (count === 0) save.schedule(value);
    else save.cancel();
  };
  return { set, errors };
}

/** Tracks fields whose text is not a number (not sent, counted as not saved). */
function useBad() {
  const [bad, setBad] = useState<Set<string>>(() => new Set());
  const mark = (field: string, isBad: boolean) => {
    const next = new Set(bad);
    if (isBad) next.add(field);
    else next.delete(field);
    setBad(next);
    return next.size;
  };
  return mark;
}

function PressureStep({ record, draft, change }: { record: CommissioningRecord; draft: Parts; change: StepChange }) {
  const p = draft.pressureTest;
  const e = change.errors.pressureTest ?? {};
  const markBad = useBad();
  const num = (field: keyof typeof p) => (v: number | null | undefined) => {
    const bad = markBad(field, v === undefined);
    change.set('pressureTest', { ...p, [field]: v === undefined ? p[field] : v }, bad);
  };
  const gas = p.testGas === null ? '' : /^(dry\s+)?(nitrogen|n2)$/i.test(p.testGas) ? 'nitrogen' : p.testGas;
  const verdict =
    p.startPsig !== null && p.startF !== null && p.endPsig !== null && p.endF !== null && p.gaugeResolutionPsi !== null
      ? safe(() =>
          standingTestReading({
            startPsig: p.startPsig!,
            startF: p.startF!,
            endPsig: p.endPsig!,
            endF: p.endF!,
            resolutionPsi: p.gaugeResolutionPsi!,
          }),
        )
      : null;
  return (
    <Card title="1 · Standing pressure test">
      <div className="flex flex-col gap-4">
        <Cautions
          title="Pressure"
          items={[
            'Dry nitrogen only, through a two-stage regulator with a relief valve — never oxygen, compressed air or a combustible gas.',
            record.testPressureLimitPsig !== null
              ? `Never above ${record.testPressureLimitPsig} psig (the catalog’s test pressure for this equipment) nor the nameplate or manual value; isolate parts not rated for it.`
              : 'The catalog gives no test pressure for this equipment: take it from the nameplate or the manual and never exceed it.',
          ]}
        />
        <FieldShell id="test-gas" label="Test gas" error={e.testGas}>
          <select
            id="test-gas"
            className={`${inputClass} text-lg`}
            value={gas}
            aria-invalid={e.testGas ? true : undefined}
            aria-describedby={e.testGas ? 'test-gas-error' : undefined}
            onChange={(ev) =>
              change.set('pressureTest', { ...p, testGas: ev.target.value === '' ? null : ev.target.value })
            }
          >
            <option value="">Choose the gas</option>
            <option value="nitrogen">Dry nitrogen</option>
            <option value="oxygen">Oxygen</option>
            <option value="compressed air">Compressed air</option>
            <option value="another gas">Another gas</option>
          </select>
        </FieldShell>
        <div className="grid grid-cols-2 gap-3">
          <NumberBox
            label="Test pressure"
            unit="psig"
            value={p.testPsig}
            error={e.testPsig}
            onValue={num('testPsig')}
            className="col-span-2"
          />
          <NumberBox
            label="Gauge’s smallest division"
            unit="psi"
            value={p.gaugeResolutionPsi}
            error={e.gaugeResolutionPsi}
            hint={
              p.testPsig
                ? `At most ${Math.round(p.testPsig * 0.05 * 10) / 10} psi (5 % of the test pressure).`
                : undefined
            }
            onValue={num('gaugeResolutionPsi')}
            className="col-span-2"
          />
          <NumberBox
            label="Start reading"
            unit="psig"
            value={p.startPsig}
            error={e.startPsig}
            onValue={num('startPsig')}
          />
          <NumberBox label="Start temperature" unit="°F" value={p.startF} error={e.startF} onValue={num('startF')} />
          <NumberBox label="End reading" unit="psig" value={p.endPsig} error={e.endPsig} onValue={num('endPsig')} />
          <NumberBox label="End temperature" unit="°F" value={p.endF} error={e.endF} onValue={num('endF')} />
          <NumberBox
            label="Hold time"
            unit="min"
            value={p.holdMinutes}
            error={e.holdMinutes}
            onValue={num('holdMinutes')}
            className="col-span-2"
          />
        </div>
        {verdict ? (
          <Verdict pass={verdict.pass} words={verdict.words} detail={verdict.text} />
        ) : (
          <Verdict
            pass={null}
            words="Enter both readings, both temperatures and the gauge’s division to see whether it held."
          />
        )}
      </div>
    </Card>
  );
}

function safe<T>(f: () => T): T | null {
  try {
    return f();
  } catch {
    return null;
  }
}

function LeaksStep({ draft, change }: { draft: Parts; change: StepChange }) {
  const leaks = draft.leaks;
  const e = change.errors.leaks ?? {};
  return (
    <Card title="2 · Leaks found and fixed">
      <div className="flex flex-col gap-3">
        {leaks.length === 0 ? <p className="text-muted">None recorded.</p> : null}
        {leaks.map((l, i) => (
          <div key={i} className="flex flex-col gap-2 rounded-md border border-line p-3">
            <TextBox
              label={`Leak ${i + 1}: where`}
              value={l.where}
              error={e[`${i}.where`]}
              onValue={(v) =>
                change.set(
                  'leaks',
                  leaks.map((x, j) => (j === i ? { ...x, where: v } : x)),
                )
              }
            />
            <TextBox
              label="How it was fixed"
              hint="e.g. flare re-made, valve core replaced"
              value={l.how}
              error={e[`${i}.how`]}
              onValue={(v) =>
                change.set(
                  'leaks',
                  leaks.map((x, j) => (j === i ? { ...x, how: v } : x)),
                )
              }
            />
            <Button
              variant="ghost"
              onClick={() =>
                change.set(
                  'leaks',
                  leaks.filter((_, j) => j !== i),
                )
              }
            >
              Remove leak {i + 1}
            </Button>
          </div>
        ))}
        <Button variant="secondary" onClick={() => change.set('leaks', [...leaks, { where: '', how: '' }])}>
          Add a leak
        </Button>
      </div>
    </Card>
  );
}

function EvacuationStep({ record, draft, change }: { record: CommissioningRecord; draft: Parts; change: StepChange }) {
  const v = draft.evacuation;
  const e = change.errors.evacuation ?? {};
  const markBad = useBad();
  const num = (field: 'reachedMicrons' | 'afterHoldMicrons' | 'holdMinutes') => (x: number | null | undefined) => {
    const bad = markBad(field, x === undefined);
    change.set('evacuation', { ...v, [field]: x === undefined ? v[field] : x }, bad);
  };
  const policy = record.policy;
  const verdict =
    v.reachedMicrons !== null && v.afterHoldMicrons !== null && v.holdMinutes !== null
      ? safe(() =>
          evacuationReading({
            reachedMicrons: v.reachedMicrons!,
            afterHoldMicrons: v.afterHoldMicrons!,
            holdMinutes: v.holdMinutes!,
            holdReadings: v.holdReadings,
            policy,
          }),
        )
      : null;
  const readings = v.holdReadings;
  return (
    <Card title="3 · Evacuation">
      <div className="flex flex-col gap-4">
        <p className="text-sm text-ink-800">
          Company policy: reach {policy.targetMicrons} microns or less, isolate the pump, and stay at or below{' '}
          {policy.maxRiseToMicrons} microns for {policy.holdMinutes} min. Measure at the system, not at the pump.
        </p>
        <div className="grid grid-cols-2 gap-3">
          <NumberBox
            label="Lowest reading"
            unit="microns"
            value={v.reachedMicrons}
            error={e.reachedMicrons}
            onValue={num('reachedMicrons')}
            className="col-span-2"
          />
          <NumberBox
            label="Reading after the hold"
            unit="microns"
            value={v.afterHoldMicrons}
            error={e.afterHoldMicrons}
            onValue={num('afterHoldMicrons')}
            className="col-span-2"
          />
          <NumberBox
            label="Hold"
            unit="min"
            value={v.holdMinutes}
            error={e.holdMinutes}
            onValue={num('holdMinutes')}
            className="col-span-2"
          />
        </div>
        <details className="rounded-md border border-line p-3">
          <summary className="min-h-touch cursor-pointer py-2 font-semibold">
            Readings during the hold ({readings.length}) — tell moisture from a leak
          </summary>
          <div className="mt-2 flex flex-col gap-3">
            {readings.map((r, i) => (
              <div key={i} className="grid grid-cols-[1fr_1fr_auto] items-end gap-2">
                <NumberBox
                  label="Minute"
                  value={r.minute}
                  error={e[`holdReadings.${i}.minute`]}
                  onValue={(x) =>
                    change.set('evacuation', {
                      ...v,
                      holdReadings: readings.map((y, j) => (j === i ? { ...y, minute: x ?? 0 } : y)),
                    })
                  }
                />
                <NumberBox
                  label="Microns"
                  value={r.microns}
                  error={e[`holdReadings.${i}.microns`]}
                  onValue={(x) =>
                    change.set('evacuation', {
                      ...v,
                      holdReadings: readings.map((y, j) => (j === i ? { ...y, microns: x ?? 0 } : y)),
                    })
                  }
                />
                <Button
                  variant="ghost"
                  aria-label={`Remove reading ${i + 1}`}
                  onClick={() => change.set('evacuation', { ...v, holdReadings: readings.filter((_, j) => j !== i) })}
                >
                  ✕
                </Button>
              </div>
            ))}
            <Button
              variant="secondary"
              onClick={() =>
                change.set('evacuation', {
                  ...v,
                  holdReadings: [...readings, { minute: (readings.at(-1)?.minute ?? -2) + 2, microns: 0 }],
                })
              }
            >
              Add a reading
            </Button>
          </div>
        </details>
        {verdict ? (
          <Verdict pass={verdict.pass} words={verdict.words} />
        ) : (
          <Verdict pass={null} words="Enter the lowest reading, the reading after the hold and the hold minutes." />
        )}
      </div>
    </Card>
  );
}

type EntryShown = RefrigerantEntryInput & { technicianName: string; enteredAt: string; waiting: boolean };

function RefrigerantStep({
  jobId,
  record,
  draft,
  change,
  entries,
  queue,
  readOnly,
}: {
  jobId: string;
  record: CommissioningRecord;
  draft: Parts;
  change: StepChange;
  entries: EntryShown[];
  queue: CommissioningQueue;
  readOnly: boolean;
}) {
  const markBad = useBad();
  return (
    <Card title="4 · Refrigerant">
      <div className="flex flex-col gap-5">
        <Cautions
          title="Refrigerant"
          items={[
            'Refrigerant work only by a certified technician (EPA 608 in the US); recover, never vent.',
            'Charge only the type on the outdoor unit’s nameplate, weighed in as liquid where the maker says so.',
            ADDITIVE_CAUTION,
          ]}
        />
        {record.systems.length === 0 ? <p className="text-muted">No system was sold on this job.</p> : null}
        {record.systems.map((s) => {
          const measured = draft.measuredLines.filter((m) => m.systemKey === s.key);
          const weighed = entries
            .filter((x) => x.systemKey === s.key)
            .reduce((sum, x) => sum + x.addedOz - x.recoveredOz, 0);
          const recomputed =
            s.precharge && s.circuits.every((c) => c.ozPerFt !== null)
              ? safe(() =>
                  recomputedExtraCharge({
                    circuits: s.circuits.map((c) => ({
                      key: c.zoneKey,
                      plannedInstalledFt: c.plannedInstalledFt,
                      measuredFt: measured.find((m) => m.zoneKey === c.zoneKey)?.measuredFt ?? null,
                      ozPerFt: c.ozPerFt ?? 0,
                    })),
                    prechargedLengthFt: s.precharge!.lengthFt,
                    prechargeBasis: s.precharge!.basis,
                    weighedInOz: Math.round(weighed * 100) / 100,
                  }),
                )
              : null;
          return (
            <section key={s.key} aria-label={s.name} className="flex flex-col gap-3 rounded-md border border-line p-3">
              <h3 className="font-semibold">
                {s.name} — {s.outdoorModel}, {s.refrigerant}
              </h3>
              <p className="text-sm font-semibold text-ink-900">
                Measured line lengths (where they differ from the plan)
              </p>
              <div className="grid gap-3 sm:grid-cols-2">
                {s.circuits.map((c) => {
                  const m = measured.find((x) => x.zoneKey === c.zoneKey);
                  return (
                    <NumberBox
                      key={c.zoneKey}
                      label={`${c.zoneName} (${c.liquid} liquid)`}
                      unit="ft"
                      hint={`Planned ${c.plannedInstalledFt} ft installed, ${c.plannedExtraOz} oz extra.`}
                      value={m?.measuredFt ?? null}
                      onValue={(x) => {
                        const bad = markBad(`${s.key}:${c.zoneKey}`, x === undefined);
                        const rest = draft.measuredLines.filter(
                          (y) => !(y.systemKey === s.key && y.zoneKey === c.zoneKey),
                        );
                        change.set(
                          'measuredLines',
                          x === null || x === undefined
                            ? rest
                            : [...rest, { systemKey: s.key, zoneKey: c.zoneKey, measuredFt: x }],
                          bad,
                        );
                      }}
                    />
                  );
                })}
              </div>
              {recomputed ? (
                <Verdict
                  pass={null}
                  words={`Extra charge for the lengths as installed: ${recomputed.extraOz} oz (planned ${recomputed.plannedOz} oz). ${recomputed.words}`}
                />
              ) : (
                <p className="text-sm text-muted">
                  The catalog has no pre-charge for this model: use the maker’s charging chart.
                </p>
              )}
              <EntryList entries={entries.filter((x) => x.systemKey === s.key)} />
              {readOnly ? null : <NewEntry jobId={jobId} system={s} askLot={record.policy.askLot} queue={queue} />}
            </section>
          );
        })}
      </div>
    </Card>
  );
}

function EntryList({ entries }: { entries: EntryShown[] }) {
  if (entries.length === 0) return <p className="text-sm text-muted">No refrigerant weighed in or out yet.</p>;
  return (
    <ul className="flex flex-col gap-1">
      {entries.map((x) => (
        <li key={x.id} className="rounded-md bg-ink-50 px-3 py-2 text-sm">
          <strong>
            {x.refrigerant}: +{x.addedOz} oz added, {x.recoveredOz} oz recovered
          </strong>
          {x.lot ? ` · lot ${x.lot}` : ''}
          {x.additives ? ` · additives: ${x.additives}` : ''} ·{' '}
          {x.waiting ? 'waiting on this phone' : `${x.technicianName}, ${new Date(x.enteredAt).toLocaleString()}`}
        </li>
      ))}
    </ul>
  );
}

function NewEntry({
  jobId,
  system,
  askLot,
  queue,
}: {
  jobId: string;
  system: CommissioningRecord['systems'][number];
  askLot: boolean;
  queue: CommissioningQueue;
}) {
  const [refrigerant, setRefrigerant] = useState(system.refrigerant);
  const [added, setAdded] = useState<number | null | undefined>(null);
  const [recovered, setRecovered] = useState<number | null | undefined>(null);
  const [lot, setLot] = useState('');
  const [additives, setAdditives] = useState('');
  const [round, setRound] = useState(0);
  const typeError =
    refrigerant !== system.refrigerant
      ? `This system takes ${system.refrigerant}. Never mix refrigerants: charge only the type on the outdoor unit’s nameplate.`
      : undefined;
  const neg = (v: number | null | undefined) =>
    v === undefined ? undefined : v !== null && v < 0 ? 'A weight cannot be negative.' : undefined;
  const empty = (added ?? 0) === 0 && (recovered ?? 0) === 0;
  const ok = !typeError && added !== undefined && recovered !== undefined && !neg(added) && !neg(recovered) && !empty;
  const record = () => {
    if (!ok) return;
    const id = crypto.randomUUID();
    void queue.enqueue({
      target: entryTarget(id),
      baseVersion: null,
      payload: {
        kind: 'refrigerant',
        jobId,
        entry: {
          id,
          systemKey: system.key,
          refrigerant,
          addedOz: added ?? 0,
          recoveredOz: recovered ?? 0,
          lot: lot.trim() || null,
          additives: additives.trim() || null,
        },
      },
    });
    setAdded(null);
    setRecovered(null);
    setLot('');
    setAdditives('');
    setRound((r) => r + 1);
  };
  return (
    <div key={round} className="flex flex-col gap-3 border-t border-line pt-3">
      <p className="font-semibold">Record a weighing</p>
      <FieldShell id={`ref-${system.key}`} label="Refrigerant" error={typeError}>
        <select
          id={`ref-${system.key}`}
          className={`${inputClass} text-lg`}
          value={refrigerant}
          aria-invalid={typeError ? true : undefined}
          aria-describedby={typeError ? `ref-${system.key}-error` : undefined}
          onChange={(e) => setRefrigerant(e.target.value)}
        >
          {[...new Set([system.refrigerant, 'R-410A', 'R-32', 'R-454B'])].map((r) => (
            <option key={r} value={r}>
              {r}
            </option>
          ))}
        </select>
      </FieldShell>
      <div className="grid grid-cols-2 gap-3">
        <NumberBox label="Added" unit="oz" value={added ?? null} error={neg(added)} onValue={setAdded} />
        <NumberBox
          label="Recovered"
          unit="oz"
          value={recovered ?? null}
          error={neg(recovered)}
          onValue={setRecovered}
        />
      </div>
      <TextBox
        label={askLot ? 'Cylinder or lot (the company keeps it)' : 'Cylinder or lot (optional)'}
        value={lot}
        onValue={setLot}
      />
      <TextBox
        label="Additives put in (name them; none if empty)"
        hint={ADDITIVE_CAUTION}
        value={additives}
        onValue={setAdditives}
      />
      <Button onClick={record} disabled={!ok}>
        Add this weighing to the record
      </Button>
    </div>
  );
}

function StartupStep({ record, draft, change }: { record: CommissioningRecord; draft: Parts; change: StepChange }) {
  const names = [...new Set([...record.policy.startupReadings, ...draft.startup.map((s) => s.name)])];
  const valueOf = (name: string) => draft.startup.find((s) => s.name === name)?.value ?? null;
  return (
    <Card title="5 · Start-up readings">
      <p className="mb-3 text-sm text-ink-800">
        Superheat and subcooling from the maker’s chart for this equipment; electrical readings by the licensed trade.
      </p>
      <div className="grid gap-3 sm:grid-cols-2">
        {names.map((name) => (
          <NumberBox
            key={name}
            label={name}
            value={valueOf(name)}
            onValue={(x) => {
              const rest = draft.startup.filter((s) => s.name !== name);
              if (x === undefined) return;
              change.set('startup', x === null ? rest : [...rest, { name, value: x, unit: '' }]);
            }}
          />
        ))}
      </div>
    </Card>
  );
}

function SignOff({
  jobId,
  record,
  waiting,
  signatureBox,
}: {
  jobId: string;
  record: CommissioningRecord;
  waiting: number;
  signatureBox: SignatureBox;
}) {
  const online = useOnline();
  const queryClient = useQueryClient();
  const [cert, setCert] = useState('');
  const [customer, setCustomer] = useState('');
  const [signature, setSignature] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  // The server's list of what is missing is current once nothing waits on this phone.
  const missing = record.missing;
  const ready = online && waiting === 0 && missing.length === 0 && customer.trim() !== '' && signature !== null;
  const run = async (f: () => Promise<void>) => {
    setBusy(true);
    setProblem(null);
    try {
      await f();
    } catch (e) {
      setProblem(isApiError(e) ? [e.detail, ...e.errors.map((x) => x.message)].join(' ') : 'Something went wrong.');
    } finally {
      setBusy(false);
    }
  };
  return (
    <Card title="6 · Sign-off">
      <div className="flex flex-col gap-4">
        {!online ? (
          <Alert tone="warning" title="Sign-off needs a connection">
            Everything entered is kept on this phone. Sign off when the signal is back and the changes have gone.
          </Alert>
        ) : waiting > 0 ? (
          <p role="status">Sending {waiting} waiting change(s) first…</p>
        ) : missing.length > 0 ? (
          <Alert tone="warning" title="Still to do before sign-off">
            <ul className="list-disc pl-5">
              {missing.map((m) => (
                <li key={m}>{m}</li>
              ))}
            </ul>
          </Alert>
        ) : null}
        {record.technicianCertNumber === null ? (
          <div className="flex flex-col gap-2">
            <TextBox
              label="Your refrigerant-handling certification number"
              hint="Kept on your profile for every record you sign."
              value={cert}
              onValue={setCert}
            />
            <Button
              variant="secondary"
              disabled={!online || cert.trim() === '' || busy}
              onClick={() =>
                run(async () => {
                  await saveCertNumber(cert.trim());
                  await queryClient.invalidateQueries({ queryKey: commissioningKeys.record(jobId) });
                })
              }
            >
              Save on my profile
            </Button>
          </div>
        ) : (
          <p>
            Certification number: <strong>{record.technicianCertNumber}</strong>
          </p>
        )}
        <TextBox label="Customer’s name" value={customer} onValue={setCustomer} />
        <div className="flex flex-col gap-1">
          <label htmlFor="ack-signature" className="text-sm font-semibold text-ink-900">
            Customer’s acknowledgement: the system was installed and started, and this record was shown to them
          </label>
          {signatureBox({ id: 'ack-signature', onChange: setSignature })}
        </div>
        {problem ? (
          <Alert tone="danger" title="Not signed off">
            {problem}
          </Alert>
        ) : null}
        <Button
          disabled={!ready}
          busy={busy}
          onClick={() =>
            run(async () => {
              const r = await signOff(jobId, record.version, { customerName: customer.trim(), signature: signature! });
              queryClient.setQueryData(commissioningKeys.record(jobId), r);
            })
          }
        >
          Sign off and mark the job installed
        </Button>
      </div>
    </Card>
  );
}

function Installed({ jobId, record }: { jobId: string; record: CommissioningRecord }) {
  const viewer = useViewer();
  const online = useOnline();
  const queryClient = useQueryClient();
  const [what, setWhat] = useState('');
  const [correction, setCorrection] = useState('');
  const [reason, setReason] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const s = record.signOff;
  return (
    <Card title="Signed off">
      <div className="flex flex-col gap-4">
        {s ? (
          <p>
            Signed off by <strong>{s.installerName}</strong> (certification {s.certNumber}) and acknowledged by{' '}
            <strong>{s.customerName}</strong> on {new Date(s.signedAt).toLocaleString()}. The record is read-only; a
            correction is added as an amendment.
          </p>
        ) : null}
        <h3 className="font-semibold">Amendments</h3>
        {record.amendments.length === 0 ? <p className="text-muted">None.</p> : null}
        <ul className="flex flex-col gap-2">
          {record.amendments.map((a) => (
            <li key={a.id} className="rounded-md bg-ink-50 p-3 text-sm">
              <strong>{a.what}:</strong> {a.correction}
              <br />
              Why: {a.reason} — {a.by}, {new Date(a.at).toLocaleString()}
            </li>
          ))}
        </ul>
        {viewer ? (
          <fieldset className="flex flex-col gap-3">
            <legend className="font-semibold">Add an amendment</legend>
            <TextBox label="What is corrected" value={what} onValue={setWhat} />
            <TextBox label="The correction" value={correction} onValue={setCorrection} />
            <TextBox label="Why" value={reason} onValue={setReason} multiline />
            {problem ? (
              <Alert tone="danger" title="Not added">
                {problem}
              </Alert>
            ) : null}
            <Button
              disabled={!online || !what.trim() || !correction.trim() || !reason.trim()}
              busy={busy}
              onClick={async () => {
                setBusy(true);
                setProblem(null);
                try {
                  const r = await addAmendment(jobId, { what, correction, reason });
                  queryClient.setQueryData(commissioningKeys.record(jobId), r);
                  setWhat('');
                  setCorrection('');
                  setReason('');
                } catch (e) {
                  setProblem(isApiError(e) ? [e.detail, ...e.errors.map((x) => x.message)].join(' ') : 'Not added.');
                } finally {
                  setBusy(false);
                }
              }}
            >
              Add the amendment
            </Button>
          </fieldset>
        ) : null}
      </div>
    </Card>
  );
}

/** After a 409: their record and this phone's step side by side, per part, with a choice for each. */
function ConflictPanel({ jobId, queue }: { jobId: string; queue: CommissioningQueue }) {
  const { state } = useCommissioningQueue();
  const queryClient = useQueryClient();
  const item = state.conflict;
  const current = useQuery({ ...recordQueryOptions(jobId), staleTime: 0 });
  if (!item || item.payload.kind !== 'record-patch') return null;
  if (!current.data || current.isFetching) return <Spinner label="Reading what the other device saved…" />;
  const theirs = partsOf(current.data);
  const minePatch = item.payload.patch;
  const labels = Object.fromEntries(Object.keys(minePatch).map((k) => [k, STEP_LABELS[k as StepKey]])) as Record<
    string,
    string
  >;
  const diffs = diffFields(minePatch, theirs, labels);
  return (
    <ConflictChoices
      title="This record was changed on another device meanwhile"
      changed="Someone saved these steps after this phone last had the record."
      diffs={diffs}
      describe={(_k, v) => (typeof v === 'string' ? v || '—' : JSON.stringify(v))}
      onResolve={(choices) => {
        const merged = mergeChoices(minePatch, theirs, choices);
        const patch = Object.fromEntries(Object.keys(minePatch).map((k) => [k, merged[k]])) as CommissioningPatch;
        queryClient.setQueryData(commissioningKeys.record(jobId), current.data);
        void queue.resolveConflict(item.id, {
          payload: { kind: 'record-patch', jobId, patch },
          baseVersion: current.data.version,
        });
      }}
    />
  );
}
