import type { PlausibilityWarning, Tightness } from '@calc';
import {
  useCallback,
  useDeferredValue,
  useEffect,
  useLayoutEffect,
  useMemo,
  useRef,
  useState,
  type ReactNode,
} from 'react';
import { QueryWidgetBoundary } from '../../../components/errors/query-widget-boundary';
import { Button } from '../../../components/ui/button';
import { RoomLoadBar } from '../../loads/components/room-load-bar';
import { RoomLoadPanel } from '../../loads/components/room-load-panel';
import type { LiveHomeInputs } from '../../loads/model/live-room';
import { append, asNumber, asRecords, asString, setIn, type PathPart } from '../model/draft';
import { floorLevelOptions } from '../model/options';
import { NEW_WALL } from '../model/room-templates';
import { checkRoom, pathKey, type FieldErrors, type RoomCheck } from '../model/validate-room';
import { sameRoomInput, saveablePart } from '../model/saveable';
import { markUnsavedFields } from '../../../lib/offline/unsaved-fields';
import type { RoomView } from '../sync/overlay';
import { roomTarget } from '../sync/edits';
import { useDebouncedSave } from '../../../lib/offline/use-debounced-save';
import { useWalkthroughQueue } from '../sync/queue-context';
import { clearUnsavedDraft, keepUnsavedDraft, takeUnsavedDraft } from '../../../lib/offline/drafts';
import { aboveBelowSummary, AboveBelowFields } from './above-below-fields';
import { ApplianceFields, peopleSummary } from './appliance-fields';
import type { Replace } from './editor-props';
import { Fold } from './fold';
import { NumberInput, SelectInput, TextInput } from './field-kit';
import { RoomPhotos } from './room-photos';
import { WallFields } from './wall-fields';

interface Props {
  jobId: string;
  room: RoomView;
  designConditions: Record<string, unknown> | null;
  tightness: Tightness;
  /** The home around the room (rooms as they stand, house facts): the live loads are the room's in the home. */
  home?: LiveHomeInputs;
}

/** No other rooms known: the room's loads as a home of its own. */
const ALONE: LiveHomeInputs = { rooms: [] };
const NO_WARNINGS: readonly PlausibilityWarning[] = [];

/** Two checks' errors say the same: the fields and parts showing them need not render again. */
function sameErrors(a: FieldErrors, b: FieldErrors): boolean {
  if (a.size !== b.size) return false;
  for (const [key, message] of a) if (b.get(key) !== message) return false;
  return true;
}

/** The room as typed and calc's check of it, made together once per change. */
interface Typed {
  readonly draft: Record<string, unknown>;
  readonly check: RoomCheck;
}

/**
 * One room, saved as it is typed: every valid change goes to the queue after a short pause.
 *
 * A keystroke re-renders the field typed in and what shows that value (a fold's line, the live loads a beat
 * later), not the whole form (issue 11): the setters keep their identity for the editor's life and write to
 * the room as it stands (`typed`, ahead of the render when keys come faster than renders), the errors keep
 * theirs while they say the same, and the fields and the walls, above/below and appliances parts are
 * memoised on the part of the room they show.
 */
export function RoomEditor({ jobId, room, designConditions, tightness, home = ALONE }: Props) {
  const queue = useWalkthroughQueue();
  // A draft the schema refused last time (still being fixed) comes back instead of the saved room,
  // also after the server moved on by this draft's own partial saves.
  const [restored] = useState(() => takeUnsavedDraft(room.id, room.version, (sent) => sameRoomInput(sent, room.input)));
  const [state, setState] = useState<Typed>(() => {
    const draft = { ...(restored?.input ?? room.input), id: room.id };
    return { draft, check: checkRoom(draft) };
  });
  const { draft, check } = state;
  // What the next change starts from: set with the change itself, so two keys before a render both count.
  const typed = useRef(state);
  // The live loads follow the form a beat behind: a keystroke renders the field at once and the loads
  // (the engine's recompute, the figures, the chart) in a render of their own right after it, which the
  // next keystroke may interrupt (issue 11: on a phone at 4× slowdown they were most of each key's work).
  const loadsCheck = useDeferredValue(check);
  const loadsRoom = loadsCheck.ok ? loadsCheck.room : null;
  const target = roomTarget(room.id);
  // What was last handed to the debounce: a partial save is not repeated while only refused fields change.
  const queued = useRef<Record<string, unknown> | null>(null);
  const { schedule, cancel } = useDebouncedSave<Record<string, unknown>>(target, (input) => {
    void queue.enqueue({
      target,
      baseVersion: room.version,
      payload: { kind: 'room-update', jobId, roomId: room.id, input },
    });
  });
  // The pill counts the fields showing an error: while any does, it never says "Saved".
  useEffect(() => markUnsavedFields(target, check.errors.size), [target, check.errors.size]);
  useEffect(() => () => markUnsavedFields(target, 0), [target]);

  const change = (next: unknown) => {
    const before = typed.current;
    const given =
      typeof next === 'function' ? (next as (latest: Record<string, unknown>) => unknown)(before.draft) : next;
    const value = typeof given === 'object' && given !== null && !Array.isArray(given) ? { ...given } : before.draft;
    const checked = checkRoom(value);
    const now: Typed = {
      draft: value,
      check: sameErrors(checked.errors, before.check.errors) ? { ...checked, errors: before.check.errors } : checked,
    };
    typed.current = now;
    setState(now);
    if (checked.ok) {
      clearUnsavedDraft(room.id);
      queued.current = value;
      schedule(value);
      return;
    }
    // A refused field is never sent, not even the prefix typed before it went over a limit: the
    // debounce gets the room with each refused field at its saved value, so the other edits of the
    // room still reach the office. The device keeps the whole draft so a reload does not lose it.
    const part = saveablePart(value, room.input);
    if (part === null || sameRoomInput(part, room.input)) {
      cancel();
      queued.current = null;
    } else if (!sameRoomInput(part, queued.current ?? room.input)) {
      queued.current = part;
      schedule(part);
    }
    keepUnsavedDraft(room.id, { baseVersion: room.version, input: value, sent: queued.current ?? undefined });
  };
  // One identity for the editor's life (what the memoised parts compare), calling this render's `change`.
  const latestChange = useRef(change);
  useLayoutEffect(() => {
    latestChange.current = change;
  });
  const replace = useCallback<Replace>((next) => latestChange.current(next), []);
  const set = useCallback(
    (path: readonly PathPart[], value: unknown) => replace((latest: unknown) => setIn(latest, path, value)),
    [replace],
  );
  const err = useCallback((path: readonly PathPart[]) => check.errors.get(pathKey(path)), [check.errors]);
  // A setter per field, made once: a field whose value and error did not change is skipped on a key elsewhere.
  const setters = useRef(new Map<string, (value: unknown) => void>());
  const setterOf = (...path: PathPart[]) => {
    const key = path.join('.');
    let setter = setters.current.get(key);
    if (!setter) {
      setter = (value: unknown) => set(path, value);
      setters.current.set(key, setter);
    }
    return setter;
  };
  const setFloorLevel = useCallback((x: string) => set(['floorLevel'], Number(x)), [set]);
  const props = { draft, set, err };
  const walls = asRecords(draft.exposedWalls);
  // Walls the room came with fold once complete; one added now opens to be filled in.
  const [wallsAtOpen] = useState(walls.length);
  const name = asString(draft.name) || 'Room';
  const errorKeys = useMemo(() => [...check.errors.keys()], [check.errors]);
  const errorUnder = (...prefixes: string[]) =>
    errorKeys.some((k) => prefixes.some((prefix) => k === prefix || k.startsWith(`${prefix}.`)));
  const aboveBelow = aboveBelowSummary(draft);
  const people = peopleSummary(draft);

  return (
    <section aria-label={`Room: ${name}`} className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_24rem]">
      <div className="flex min-w-0 flex-col gap-5">
        {restored && !check.ok ? (
          <p
            role="note"
            className="rounded-md border border-amber-line bg-amber-soft px-3 py-2 text-sm text-amber-deep"
          >
            Brought back what you were typing here. The fields marked in red are not saved until they are fixed.
          </p>
        ) : null}
        <div className="grid grid-cols-2 gap-3 sm:grid-cols-3">
          <div className="col-span-2 sm:col-span-1">
            <TextInput
              label="Room name"
              value={asString(draft.name)}
              onChange={setterOf('name')}
              error={err(['name'])}
            />
          </div>
          <SelectInput
            label="Floor level"
            value={String(asNumber(draft.floorLevel) ?? 1)}
            options={floorLevelOptions}
            onChange={setFloorLevel}
            error={err(['floorLevel'])}
          />
          <NumberInput
            label="Length"
            quantity="ft"
            value={asNumber(draft.lengthFt)}
            onChange={setterOf('lengthFt')}
            error={err(['lengthFt'])}
          />
          <NumberInput
            label="Width"
            quantity="ft"
            value={asNumber(draft.widthFt)}
            onChange={setterOf('widthFt')}
            error={err(['widthFt'])}
          />
          <NumberInput
            label="Floor area"
            hint="Only if length × width does not fit"
            quantity="ft2"
            value={asNumber(draft.areaFt2)}
            onChange={setterOf('areaFt2')}
            error={err(['areaFt2'])}
          />
          <NumberInput
            label="Ceiling height"
            quantity="ft"
            value={asNumber(draft.ceilingHeightFt)}
            onChange={setterOf('ceilingHeightFt')}
            error={err(['ceilingHeightFt'])}
          />
        </div>

        <div className="flex flex-col gap-3">
          <h3 className="text-lg font-semibold text-ink-900">Outside walls</h3>
          {err(['exposedWalls']) ? <p className="text-sm font-semibold text-danger">{err(['exposedWalls'])}</p> : null}
          {walls.map((_, i) => (
            <WallFields
              key={i}
              index={i}
              replace={replace}
              startOpen={i >= wallsAtOpen}
              hasError={errorUnder(`exposedWalls.${i}`)}
              errorKeys={errorKeys}
              {...props}
            />
          ))}
          <div>
            <Button
              variant="secondary"
              onClick={() => replace((latest: unknown) => append(latest, ['exposedWalls'], NEW_WALL))}
            >
              Add wall
            </Button>
          </div>
        </div>

        {/* Complete sections fold to one line (as walls do): a tap on the line opens them. */}
        <SectionFold title="Above and below" summary={aboveBelow} hasError={errorUnder('above', 'below')}>
          <div className="pt-2">
            <AboveBelowFields {...props} />
          </div>
        </SectionFold>

        <SectionFold title="People and appliances" summary={people} hasError={errorUnder('occupants', 'appliances')}>
          <div className="flex flex-col gap-3 pt-2">
            <div className="max-w-48">
              <NumberInput
                label="Occupants"
                integer
                unit="people"
                value={asNumber(draft.occupants)}
                onChange={setterOf('occupants')}
                error={err(['occupants'])}
              />
            </div>
            <ApplianceFields replace={replace} {...props} />
          </div>
        </SectionFold>

        <TextInput
          label="Notes"
          multiline
          value={asString(draft.notes)}
          onChange={setterOf('notes')}
          error={err(['notes'])}
        />

        <QueryWidgetBoundary name="the room photos">
          <RoomPhotos jobId={jobId} room={room} />
        </QueryWidgetBoundary>
      </div>
      {/* On a phone the loads stay in sight as one line pinned to the bottom of the screen. */}
      <RoomLoadBar room={loadsRoom} designConditions={designConditions} tightness={tightness} home={home} />
      {/* On a wide screen the loads stay in view beside the form while it is filled in. */}
      <aside className="min-w-0 lg:sticky lg:top-36 lg:self-start">
        <QueryWidgetBoundary name="the room loads">
          <RoomLoadPanel
            room={loadsRoom}
            warnings={loadsCheck.ok ? loadsCheck.warnings : NO_WARNINGS}
            designConditions={designConditions}
            tightness={tightness}
            home={home}
          />
        </QueryWidgetBoundary>
      </aside>
    </section>
  );
}

/** A room section that folds to its heading and a one-line summary once complete (as walls do). */
function SectionFold({
  title,
  summary,
  hasError,
  children,
}: {
  title: string;
  summary: { readonly text: string; readonly complete: boolean };
  hasError: boolean;
  children: ReactNode;
}) {
  return (
    <Fold
      summary={
        <>
          <h3 className="shrink-0 text-lg font-semibold text-ink-900">{title}</h3>
          <span className="min-w-0 text-sm text-muted">{summary.text}</span>
        </>
      }
      complete={summary.complete}
      hasError={hasError}
      summaryClassName="flex-wrap gap-x-3"
    >
      {children}
    </Fold>
  );
}
