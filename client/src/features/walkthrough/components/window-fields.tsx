import { Button } from '../../../components/ui/button';
import { asNumber, asRecord, asString, getIn } from '../model/draft';
import { glazingDefaults, glazingOptions, shadingHint, shadingOptions } from '../model/options';
import type { EditorProps } from './editor-props';
import { NumberInput, SelectInput } from './field-kit';
import { OpeningFields } from './opening-fields';
import { Fold, optionLabel } from './fold';

/** "Window 1: 36 × 48 in, Double, clear ×2", or what is still missing. */
export function windowSummary(w: Record<string, unknown>, index: number): { text: string; complete: boolean } {
  const width = asNumber(w.widthIn);
  const height = asNumber(w.heightIn);
  const area = asNumber(w.areaFt2);
  const count = asNumber(w.count);
  const size =
    area !== undefined ? `${area} ft²` : width !== undefined && height !== undefined ? `${width} × ${height} in` : null;
  const glazing = optionLabel(glazingOptions, asString(w.glazing, 'double-clear'));
  const times = count !== undefined && count > 1 ? ` ×${count}` : '';
  return {
    text: `Window ${index + 1}: ${size ?? 'no size yet'}, ${glazing}${times}`,
    complete: size !== null && count !== undefined,
  };
}

export function WindowFields({
  index,
  onRemove,
  startOpen,
  hasError,
  ...opening
}: EditorProps & {
  base: readonly (string | number)[];
  index: number;
  onRemove: () => void;
  /** Added during this visit: opens to be filled in. */
  startOpen: boolean;
  /** A field of this window shows an error: it stays open. */
  hasError: boolean;
}) {
  const { draft, set, err, base } = opening;
  const p = (k: string) => [...base, k];
  const v = (k: string) => getIn(draft, p(k));
  const glazing = asString(v('glazing'), 'double-clear');
  const defaults = glazingDefaults(glazing);
  const summary = windowSummary(asRecord(getIn(draft, base)), index);
  return (
    <Fold
      summary={summary.text}
      complete={summary.complete}
      hasError={hasError}
      startOpen={startOpen}
      className="rounded-md border border-line bg-white"
      summaryClassName="px-3 text-sm font-semibold text-ink-800"
    >
      <fieldset className="border-t border-line p-3">
        <legend className="sr-only">Window {index + 1}</legend>
        <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
          <OpeningFields
            {...opening}
            noun="Window"
            kind={{ label: 'Glazing', key: 'glazing', value: glazing, options: glazingOptions }}
            uHint={
              defaults
                ? `Btu/h·ft²·°F, from the label. Blank uses ${defaults.u} (typical ${defaults.label.toLowerCase()})`
                : 'Btu/h·ft²·°F, from the label'
            }
          />
          <NumberInput
            label="Window SHGC"
            value={asNumber(v('shgc'))}
            onChange={(x) => set(p('shgc'), x)}
            error={err(p('shgc'))}
            hint={defaults ? `From the label. Blank uses ${defaults.shgc}` : 'From the label'}
          />
          <SelectInput
            label="Interior shading"
            value={asString(v('interiorShading'), 'none')}
            options={shadingOptions}
            onChange={(x) => set(p('interiorShading'), x)}
            error={err(p('interiorShading'))}
            hint={shadingHint(asString(v('interiorShading'), 'none'), asNumber(v('shgc')) ?? defaults?.shgc)}
          />
          <NumberInput
            label="Overhang depth"
            hint="Eave or porch roof over the window, how far it sticks out. Blank: none"
            quantity="ft"
            value={asNumber(v('overhangDepthFt'))}
            onChange={(x) => set(p('overhangDepthFt'), x)}
            error={err(p('overhangDepthFt'))}
          />
          <NumberInput
            label="Overhang above the window top"
            hint="Blank: right at the window head"
            quantity="ft"
            value={asNumber(v('overhangGapFt'))}
            onChange={(x) => set(p('overhangGapFt'), x)}
            error={err(p('overhangGapFt'))}
          />
        </div>
        <Button variant="ghost" className="mt-2" onClick={onRemove}>
          Remove window {index + 1}
        </Button>
      </fieldset>
    </Fold>
  );
}
