import { Button } from '../../../components/ui/button';
import { asNumber, asString, getIn } from '../model/draft';
import { doorDefault, doorTypeOptions } from '../model/options';
import type { EditorProps } from './editor-props';
import { NumberInput, SelectInput } from './field-kit';

export function DoorFields({
  draft,
  set,
  err,
  base,
  index,
  onRemove,
}: EditorProps & { base: readonly (string | number)[]; index: number; onRemove: () => void }) {
  const p = (k: string) => [...base, k];
  const v = (k: string) => getIn(draft, p(k));
  const doorType = asString(v('doorType'), 'insulated-steel');
  const def = doorDefault(doorType);
  return (
    <fieldset className="rounded-md border border-line p-3">
      <legend className="px-1 text-sm font-semibold text-ink-800">Door {index + 1}</legend>
      <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
        <NumberInput
          label="Door width"
          quantity="in"
          value={asNumber(v('widthIn'))}
          onChange={(x) => set(p('widthIn'), x)}
          error={err(p('widthIn'))}
        />
        <NumberInput
          label="Door height"
          quantity="in"
          value={asNumber(v('heightIn'))}
          onChange={(x) => set(p('heightIn'), x)}
          error={err(p('heightIn'))}
        />
        <NumberInput
          label="Door area"
          hint="Instead of width × height"
          quantity="ft2"
          value={asNumber(v('areaFt2'))}
          onChange={(x) => set(p('areaFt2'), x)}
          error={err(p('areaFt2'))}
        />
        <NumberInput
          label="Door count"
          integer
          value={asNumber(v('count'))}
          onChange={(x) => set(p('count'), x)}
          error={err(p('count'))}
        />
        <SelectInput
          label="Door type"
          value={doorType}
          options={doorTypeOptions}
          onChange={(x) => set(p('doorType'), x)}
          error={err(p('doorType'))}
        />
        <NumberInput
          label="Door U-factor"
          value={asNumber(v('uFactor'))}
          onChange={(x) => set(p('uFactor'), x)}
          error={err(p('uFactor'))}
          hint={def ? `Btu/h·ft²·°F. Blank uses ${def.u}` : 'Btu/h·ft²·°F'}
        />
      </div>
      <Button variant="ghost" className="mt-2" onClick={onRemove}>
        Remove door {index + 1}
      </Button>
    </fieldset>
  );
}
