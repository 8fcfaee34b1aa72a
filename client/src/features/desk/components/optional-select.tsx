import { SelectOptions } from '../../../components/ui/field-shell';
import { ControlledField, type FieldFrameProps } from './controlled-field';

/** Longer than this, a choice is cut short in a 375 px phone's select box. */
const LONG_CHOICE = 26;

/**
 * A select for an optional field: its first choice ('') leaves the field out (undefined), as calc's schema
 * wants for "no heat kit", "no ducts" or "the zone's first room"; `toValue` and `fromValue` may hold an object
 * behind the choice (a unit's own ducts: the location chosen, the rest kept).
 */
export function OptionalSelect({
  options,
  toValue = (v) => (v === '' ? undefined : v),
  fromValue = (v) => (typeof v === 'string' ? v : ''),
  ...frame
}: FieldFrameProps & {
  options: readonly { value: string; label: string }[];
  toValue?: (chosen: string, current: unknown) => unknown;
  fromValue?: (value: unknown) => string;
}) {
  return (
    <ControlledField {...frame}>
      {(field, control) => {
        const chosen = options.find((o) => o.value === fromValue(field.value))?.label ?? '';
        return (
          <>
            <select
              {...control}
              value={fromValue(field.value)}
              onChange={(e) => field.onChange(toValue(e.target.value, field.value))}
              onBlur={field.onBlur}
            >
              <SelectOptions options={options} />
            </select>
            {/* A phone's select cuts a long choice short ("Tessaline 5 kW electric…"): the whole of it under the
                box, for the eye only (the select itself tells a screen reader). */}
            {chosen.length > LONG_CHOICE ? (
              <p className="text-sm text-ink-900 sm:hidden" aria-hidden="true" data-testid="chosen-in-full">
                {chosen}
              </p>
            ) : null}
          </>
        );
      }}
    </ControlledField>
  );
}

/**
 * A select that holds its value through the form (controlled). The desk's forms use it rather than a
 * registered select: in field-array rows a registered select took its first choice on mount ("Choose an
 * indoor unit"), so a stored design looked changed right after it was saved.
 */
export function Choice(props: FieldFrameProps & { options: readonly { value: string; label: string }[] }) {
  return <OptionalSelect {...props} toValue={(v) => v} />;
}
