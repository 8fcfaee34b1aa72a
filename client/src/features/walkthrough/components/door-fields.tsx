import { Button } from '../../../components/ui/button';
import { asString, getIn } from '../model/draft';
import { doorDefault, doorTypeOptions } from '../model/options';
import type { EditorProps } from './editor-props';
import { OpeningFields } from './opening-fields';

export function DoorFields({
  index,
  onRemove,
  ...opening
}: EditorProps & { base: readonly (string | number)[]; index: number; onRemove: () => void }) {
  const doorType = asString(getIn(opening.draft, [...opening.base, 'doorType']), 'insulated-steel');
  const def = doorDefault(doorType);
  return (
    <fieldset className="rounded-md border border-line p-3">
      <legend className="px-1 text-sm font-semibold text-ink-800">Door {index + 1}</legend>
      <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
        <OpeningFields
          {...opening}
          noun="Door"
          kind={{ label: 'Door type', key: 'doorType', value: doorType, options: doorTypeOptions }}
          uHint={def ? `Btu/h·ft²·°F. Blank uses ${def.u}` : 'Btu/h·ft²·°F'}
        />
      </div>
      <Button variant="ghost" className="mt-2" onClick={onRemove}>
        Remove door {index + 1}
      </Button>
    </fieldset>
  );
}
