import { memo, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { append, asNumber, asRecords, asString, getIn, removeAt } from '../model/draft';
import { constructionOptions, directionOptions } from '../model/options';
import { DoorFields } from './door-fields';
import { sameDraftParts, type EditorProps, type Replace } from './editor-props';
import { NumberInput, SelectInput } from './field-kit';
import { Fold } from './fold';
import { WindowFields } from './window-fields';

/** Outside colour of a wall or roof: sets how much sun it absorbs (sol-air temperature). */
export const COLOR_OPTIONS = [
  { value: 'light', label: 'Light' },
  { value: 'medium', label: 'Medium' },
  { value: 'dark', label: 'Dark' },
];
export const NEW_WINDOW = { widthIn: 36, heightIn: 48, count: 1, glazing: 'double-clear', interiorShading: 'none' };
export const NEW_DOOR = { widthIn: 36, heightIn: 80, count: 1, doorType: 'insulated-steel' };

interface WallProps extends EditorProps {
  index: number;
  replace: Replace;
  /** Some field of this wall (or its windows and doors) shows an error. */
  hasError: boolean;
  /** Added during this visit: opens unfolded to be filled in. */
  startOpen: boolean;
  /** The room's fields showing an error, by path key ("exposedWalls.0.windows.1.widthIn"). */
  errorKeys: readonly string[];
}

/** One exposed wall: facing, length, construction, and the windows and doors in it. Re-renders when its own wall changes. */
export const WallFields = memo(
  function WallFields({ draft, set, err, index, replace, hasError, startOpen, errorKeys }: WallProps) {
    const base = ['exposedWalls', index] as const;
    const p = (...k: (string | number)[]) => [...base, ...k];
    const v = (k: string) => getIn(draft, p(k));
    const windows = asRecords(v('windows'));
    const doors = asRecords(v('doors'));
    // Windows the wall came with fold once complete; one added now opens to be filled in.
    const [windowsAtOpen] = useState(windows.length);
    const length = asNumber(v('lengthFt'));
    const count = (n: number, one: string) => `${n} ${one}${n === 1 ? '' : 's'}`;
    const summary = `Wall ${index + 1}: faces ${asString(v('direction'), 'N')}, ${length === undefined ? 'no length yet' : `${length} ft`}, ${count(windows.length, 'window')}, ${count(doors.length, 'door')}`;
    return (
      <Fold
        summary={summary}
        complete={length !== undefined}
        hasError={hasError}
        startOpen={startOpen}
        className="rounded-lg border border-ink-200 bg-ink-50/40"
        summaryClassName="px-3 font-semibold text-ink-900"
      >
        <fieldset className="flex flex-col gap-3 border-t border-ink-200 p-3">
          <legend className="sr-only">Wall {index + 1}</legend>
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
            <SelectInput
              label="Wall faces"
              value={asString(v('direction'), 'N')}
              options={directionOptions}
              onChange={(x) => set(p('direction'), x)}
              error={err(p('direction'))}
            />
            <NumberInput
              label="Wall length"
              quantity="ft"
              value={asNumber(v('lengthFt'))}
              onChange={(x) => set(p('lengthFt'), x)}
              error={err(p('lengthFt'))}
            />
            <NumberInput
              label="Wall height"
              hint="Blank uses the ceiling height"
              quantity="ft"
              value={asNumber(v('heightFt'))}
              onChange={(x) => set(p('heightFt'), x)}
              error={err(p('heightFt'))}
            />
            <SelectInput
              label="Construction"
              value={asString(v('construction'), 'wood-2x4-r13')}
              options={constructionOptions}
              onChange={(x) => set(p('construction'), x)}
              error={err(p('construction'))}
            />
            <SelectInput
              label="Outside colour"
              value={asString(v('color'), 'medium')}
              options={COLOR_OPTIONS}
              onChange={(x) => set(p('color'), x)}
              error={err(p('color'))}
            />
            <NumberInput
              label="Below grade"
              hint="Basement wall: how much of its height is in the ground. Blank: none."
              quantity="ft"
              value={asNumber(v('belowGradeFt'))}
              onChange={(x) => set(p('belowGradeFt'), x)}
              error={err(p('belowGradeFt'))}
            />
          </div>
          {err(p('windows')) ? <p className="text-sm font-semibold text-danger">{err(p('windows'))}</p> : null}
          {windows.map((_, wi) => (
            <WindowFields
              key={wi}
              draft={draft}
              set={set}
              err={err}
              base={p('windows', wi)}
              index={wi}
              startOpen={wi >= windowsAtOpen}
              hasError={errorKeys.some((k) => k.startsWith(`exposedWalls.${index}.windows.${wi}.`))}
              onRemove={() => replace((latest: unknown) => removeAt(latest, p('windows'), wi))}
            />
          ))}
          {doors.map((_, di) => (
            <DoorFields
              key={di}
              draft={draft}
              set={set}
              err={err}
              base={p('doors', di)}
              index={di}
              onRemove={() => replace((latest: unknown) => removeAt(latest, p('doors'), di))}
            />
          ))}
          <div className="flex flex-wrap gap-2">
            <Button
              variant="secondary"
              onClick={() => replace((latest: unknown) => append(latest, p('windows'), NEW_WINDOW))}
            >
              Add window
            </Button>
            <Button
              variant="secondary"
              onClick={() => replace((latest: unknown) => append(latest, p('doors'), NEW_DOOR))}
            >
              Add door
            </Button>
            <Button
              variant="ghost"
              onClick={() => replace((latest: unknown) => removeAt(latest, ['exposedWalls'], index))}
            >
              Remove wall {index + 1}
            </Button>
          </div>
        </fieldset>
      </Fold>
    );
  },
  sameDraftParts<WallProps>(({ draft, index }) => [getIn(draft, ['exposedWalls', index])]),
);
