import type { ReactNode } from 'react';
import { asNumber, getIn, type PathPart } from '../model/draft';
import type { EditorProps } from './editor-props';
import { NumberInput, SelectInput } from './field-kit';

/**
 * What a window and a door share in the walk-through: the size (width and height, or the area instead),
 * how many alike, what kind it is (`kind`: the door type, the glazing) and its U-factor, whose hint says
 * what a blank uses for that kind. Each label names the opening ("Window width", "Door U-factor").
 */
export function OpeningFields({
  draft,
  set,
  err,
  base,
  noun,
  kind,
  uHint,
}: EditorProps & {
  base: readonly PathPart[];
  noun: 'Window' | 'Door';
  kind: { label: string; key: string; value: string; options: readonly { value: string; label: string }[] };
  uHint: ReactNode;
}) {
  const p = (k: string) => [...base, k];
  const at = (k: string) => ({
    value: asNumber(getIn(draft, p(k))),
    onChange: (x: number | undefined) => set(p(k), x),
    error: err(p(k)),
  });
  return (
    <>
      <NumberInput label={`${noun} width`} quantity="in" {...at('widthIn')} />
      <NumberInput label={`${noun} height`} quantity="in" {...at('heightIn')} />
      <NumberInput label={`${noun} area`} hint="Instead of width × height" quantity="ft2" {...at('areaFt2')} />
      <NumberInput label={`${noun} count`} integer {...at('count')} />
      <SelectInput
        label={kind.label}
        value={kind.value}
        options={kind.options}
        onChange={(x) => set(p(kind.key), x)}
        error={err(p(kind.key))}
      />
      <NumberInput label={`${noun} U-factor`} hint={uHint} {...at('uFactor')} />
    </>
  );
}
