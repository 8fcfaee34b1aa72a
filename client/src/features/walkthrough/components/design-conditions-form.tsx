import { useEffect, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { INFILTRATION_TIGHTNESS, houseSchema } from '@calc';
import { enteredOf, notesOf, resolveDesign, type DesignNotes, type EnteredDesign, type JobRecord } from '@contract';
import { DESIGN_FIELD_SPECS } from '../../../entities/job/design-fields';
import type { JobChanges } from '../../../entities/job/requests';
import { jobTarget } from '../sync/edits';
import { useWalkthroughQueue } from '../sync/queue-context';
import { useDebouncedSave } from '../../../lib/offline/use-debounced-save';
import { markUnsavedFields } from '../../../lib/offline/unsaved-fields';
import { NumberInput, SelectInput, TextInput } from './field-kit';
import { HouseFields, type HouseDraft } from './house-fields';
import { MONTH_NAMES } from '../../../lib/months';
import { LatitudeField } from './latitude-field';

const NOTICE =
  'Design values must come from the local code’s climate table or a recognised climatic data source for the site.';
const sourceLabels = {
  entered: 'Entered for this job',
  'company-default': 'Company default',
  'standard-default': 'Standard default',
} as const;
// The design month as people say it; empty leaves calc's usual month for the latitude.
const MONTH_OPTIONS = [
  { value: '', label: 'Usual for the latitude' },
  ...MONTH_NAMES.map((name, i) => ({ value: String(i + 1), label: name })),
];
const tightnessOptions = Object.entries(INFILTRATION_TIGHTNESS).map(([value, t]) => ({ value, label: t.label }));

interface Props {
  job: JobRecord;
  companyDefaults: Record<string, unknown> | null;
  notice?: string | undefined;
}

/** The site's design conditions: company defaults prefill, each value says where it came from. Autosaved. */
export function DesignConditionsForm({ job, companyDefaults, notice }: Props) {
  const queue = useWalkthroughQueue();
  const [entered, setEntered] = useState<EnteredDesign>(() => enteredOf(job.designConditions, job.designSources));
  const [notes, setNotes] = useState<DesignNotes>(() => notesOf(job.designSources));
  const [source, setSource] = useState(() =>
    typeof job.designConditions?.source === 'string' ? job.designConditions.source : '',
  );
  const [tightness, setTightness] = useState<string>(job.tightness);
  const [skySource, setSkySource] = useState(() =>
    typeof job.designConditions?.clearSkySource === 'string' ? job.designConditions.clearSkySource : '',
  );
  const [house, setHouse] = useState<HouseDraft>(() => job.house ?? {});
  const resolve = (e: EnteredDesign, s: string, sky = skySource) =>
    resolveDesign({ ...e, source: s, clearSkySource: sky }, companyDefaults);
  const resolved = resolve(entered, source);
  const errors = new Map<string, string>();
  for (const i of resolved.issues) if (!errors.has(i.path)) errors.set(i.path, i.message);

  // Fields typed but refused, so not sent: counted from the person's last edit only (values the job
  // already held before it was opened are not "unsaved").
  const [refused, setRefused] = useState(0);
  const target = jobTarget(job.id);
  useEffect(() => markUnsavedFields(`${target}:design`, refused), [target, refused]);
  useEffect(() => () => markUnsavedFields(`${target}:design`, 0), [target]);

  const { schedule, cancel } = useDebouncedSave<JobChanges>(target, (changes) => {
    void queue.enqueue({
      target: jobTarget(job.id),
      baseVersion: job.version,
      payload: { kind: 'job-update', jobId: job.id, changes },
    });
  });
  const save = (next: {
    entered?: EnteredDesign;
    notes?: DesignNotes;
    source?: string;
    skySource?: string;
    tightness?: string;
    house?: HouseDraft;
  }) => {
    const e = next.entered ?? entered;
    const n = next.notes ?? notes;
    const s = next.source ?? source;
    const sky = next.skySource ?? skySource;
    const t = next.tightness ?? tightness;
    const h = next.house ?? house;
    // Nothing is sent while a field shows an error, not even the prefix typed before it went over
    // a limit (it may be waiting in the debounce): the pill says what is not saved meanwhile.
    const issues = resolve(e, s, sky).issues.length + (houseSchema.safeParse(h).success ? 0 : 1);
    setRefused(issues);
    if (issues > 0) {
      cancel();
      return;
    }
    const designConditions: Record<string, number | string> = {};
    for (const [k, v] of Object.entries(e))
      if (k !== 'source' && k !== 'clearSkySource' && v !== undefined) designConditions[k] = v;
    if (s.trim()) designConditions.source = s.trim();
    if (sky.trim()) designConditions.clearSkySource = sky.trim();
    schedule({
      designConditions,
      designSourceNotes: Object.fromEntries(Object.entries(n).filter(([, v]) => v.trim() !== '')),
      tightness: t,
      house: h,
    });
  };

  const hintOf = (f: (typeof DESIGN_FIELD_SPECS)[number], origin: keyof typeof sourceLabels, value: unknown) => (
    <>
      <span data-source={origin}>Source: {sourceLabels[origin]}</span>
      {f.whenEmpty && value === undefined ? <span className="block">{f.whenEmpty}</span> : null}
    </>
  );
  const change = (key: (typeof DESIGN_FIELD_SPECS)[number]['key'], v: number | undefined) => {
    // Emptying a field with a company default must not snap the default back in while typing.
    const typed = v === undefined && typeof companyDefaults?.[key] === 'number' ? Number.NaN : v;
    const next = { ...entered, [key]: typed };
    setEntered(next);
    save({ entered: next });
  };

  return (
    <section aria-label="Design conditions" className="flex flex-col gap-4">
      <p className="rounded-md border-l-4 border-amber-line bg-amber-soft px-4 py-3 text-ink-950">{notice ?? NOTICE}</p>
      <div className="grid gap-4 sm:grid-cols-2">
        {DESIGN_FIELD_SPECS.map((f) => {
          const value = resolved.shown[f.key];
          const origin = resolved.origin[f.key];
          return (
            <div key={f.key} className="flex flex-col gap-2 rounded-md border border-line p-3">
              {f.key === 'latitudeDeg' ? (
                <LatitudeField
                  value={typeof value === 'number' ? value : undefined}
                  error={errors.get(f.key)}
                  hint={hintOf(f, origin, value)}
                  onChange={(v) => change(f.key, v)}
                />
              ) : f.key === 'designMonth' ? (
                <>
                  <SelectInput
                    label={f.label}
                    value={typeof value === 'number' ? String(value) : ''}
                    options={MONTH_OPTIONS}
                    error={errors.get(f.key)}
                    onChange={(x) => change(f.key, x === '' ? undefined : Number(x))}
                  />
                  <p className="text-sm text-muted">{hintOf(f, origin, value)}</p>
                </>
              ) : (
                <NumberInput
                  label={f.label}
                  quantity={f.quantity}
                  unit={f.unit ?? ''}
                  value={typeof value === 'number' ? value : undefined}
                  error={errors.get(f.key)}
                  integer={f.integer ?? false}
                  hint={hintOf(f, origin, value)}
                  onChange={(v) => change(f.key, v)}
                />
              )}
              {origin === 'entered' && typeof companyDefaults?.[f.key] === 'number' ? (
                <Button
                  variant="ghost"
                  onClick={() => {
                    const next = { ...entered, [f.key]: undefined };
                    setEntered(next);
                    save({ entered: next });
                  }}
                >
                  Use company default for {f.label.toLowerCase()}
                </Button>
              ) : null}
              <TextInput
                label={`Where ${f.label.toLowerCase()} came from`}
                value={notes[f.key] ?? ''}
                onChange={(v) => {
                  const next = { ...notes, [f.key]: v };
                  setNotes(next);
                  save({ notes: next });
                }}
              />
            </div>
          );
        })}
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextInput
          label="Source of the design values (e.g. the local code table)"
          value={source}
          error={errors.get('source')}
          onChange={(v) => {
            setSource(v);
            save({ source: v });
          }}
        />
        <TextInput
          label="Source of τb and τd (station and month of the climatic table)"
          value={skySource}
          error={errors.get('clearSkySource')}
          onChange={(v) => {
            setSkySource(v);
            save({ skySource: v });
          }}
        />
        <SelectInput
          label="How tight is the house"
          value={tightness}
          options={tightnessOptions}
          onChange={(v) => {
            setTightness(v);
            save({ tightness: v });
          }}
        />
      </div>
      <HouseFields
        value={house}
        onChange={(next) => {
          setHouse(next);
          save({ house: next });
        }}
      />
    </section>
  );
}
