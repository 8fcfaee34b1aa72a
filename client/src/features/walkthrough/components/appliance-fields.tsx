import { memo } from 'react';
import { Button } from '../../../components/ui/button';
import { append, asNumber, asRecords, asString, removeAt } from '../model/draft';
import { sameDraftParts, type EditorProps, type Replace } from './editor-props';
import { NumberInput, SelectInput, TextInput } from './field-kit';

/** "2 people · 1 appliance (Lamp 100 W)": the people section's folded line. */
export function peopleSummary(draft: Record<string, unknown>): { text: string; complete: boolean } {
  const occupants = asNumber(draft.occupants);
  const items = asRecords(draft.appliances);
  const people = occupants === undefined ? 'no occupants yet' : `${occupants} ${occupants === 1 ? 'person' : 'people'}`;
  const list = items.map(
    (a) => `${asString(a.label, 'Appliance')} ${asNumber(a.gain) ?? '?'} ${asString(a.unit, 'W')}`,
  );
  const appliances =
    items.length === 0
      ? 'no appliances'
      : `${items.length} appliance${items.length === 1 ? '' : 's'} (${list.join(', ')})`;
  return {
    text: `${people} · ${appliances}`,
    complete: occupants !== undefined && items.every((a) => asString(a.label) !== '' && asNumber(a.gain) !== undefined),
  };
}

/** Heat-producing appliances and lights of the room. */
type ApplianceProps = EditorProps & { replace: Replace };

/** Re-renders when the appliances change. */
export const ApplianceFields = memo(
  function ApplianceFields({ draft, set, err, replace }: ApplianceProps) {
    const items = asRecords(draft.appliances);
    return (
      <div className="flex flex-col gap-3">
        {items.map((a, i) => {
          const p = (k: string) => ['appliances', i, k];
          return (
            <fieldset key={i} className="grid grid-cols-2 gap-3 rounded-md border border-line p-3 sm:grid-cols-4">
              <legend className="px-1 text-sm font-semibold text-ink-800">Appliance {i + 1}</legend>
              <TextInput
                label="Appliance name"
                value={asString(a.label)}
                onChange={(x) => set(p('label'), x)}
                error={err(p('label'))}
              />
              <NumberInput
                label="Heat given off"
                value={asNumber(a.gain)}
                unit={asString(a.unit, 'W')}
                onChange={(x) => set(p('gain'), x)}
                error={err(p('gain'))}
              />
              <SelectInput
                label="Gain unit"
                value={asString(a.unit, 'W')}
                options={[
                  { value: 'W', label: 'W' },
                  { value: 'Btu/h', label: 'Btu/h' },
                ]}
                onChange={(x) => set(p('unit'), x)}
              />
              <NumberInput
                label="Moisture (latent) gain"
                unit="Btu/h"
                value={asNumber(a.latentBtuh)}
                onChange={(x) => set(p('latentBtuh'), x)}
                error={err(p('latentBtuh'))}
              />
              <Button variant="ghost" onClick={() => replace((latest: unknown) => removeAt(latest, ['appliances'], i))}>
                Remove appliance {i + 1}
              </Button>
            </fieldset>
          );
        })}
        <div>
          <Button
            variant="secondary"
            onClick={() =>
              replace((latest: unknown) =>
                append(latest, ['appliances'], { label: 'Appliance', gain: 100, unit: 'W', latentBtuh: 0 }),
              )
            }
          >
            Add appliance
          </Button>
        </div>
      </div>
    );
  },
  sameDraftParts<ApplianceProps>(({ draft }) => [draft.appliances]),
);
