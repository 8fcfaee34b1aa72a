import { memo } from 'react';
import { asNumber, asRecord, asString } from '../model/draft';
import { aboveOptions, belowOptions, ceilingInsulationOptions, floorInsulationOptions } from '../model/options';
import { sameDraftParts, type EditorProps } from './editor-props';
import { NumberInput, SelectInput } from './field-kit';
import { optionLabel } from './fold';
import { COLOR_OPTIONS } from './wall-fields';

/** "Above: Attic, R-38 · Below: Crawl space, vented, no insulation": the section's folded line. */
export function aboveBelowSummary(draft: Record<string, unknown>): { text: string; complete: boolean } {
  const above = asRecord(draft.above);
  const below = asRecord(draft.below);
  const aboveKind = asString(above.kind);
  const belowKind = asString(below.kind);
  const up = [optionLabel(aboveOptions, aboveKind || 'conditioned')];
  if (aboveKind === 'attic' || aboveKind === 'roof')
    up.push(optionLabel(ceilingInsulationOptions, asString(above.insulation, 'r30')));
  const down = [optionLabel(belowOptions, belowKind || 'conditioned')];
  if (belowKind === 'crawlspace') down.push(below.vented === false ? 'closed' : 'vented');
  if (belowKind === 'slab') down.push(below.edgeInsulated === true ? 'edge insulated' : 'edge not insulated');
  if (belowKind === 'crawlspace' || belowKind === 'basement' || belowKind === 'garage')
    down.push(optionLabel(floorInsulationOptions, asString(below.insulation, 'none')).toLowerCase());
  const depth = asNumber(below.depthFt);
  if (belowKind === 'basement-floor') down.push(depth === undefined ? 'no depth yet' : `${depth} ft down`);
  return {
    text: `Above: ${up.join(', ')} · Below: ${down.join(', ')}`,
    complete: aboveKind !== '' && belowKind !== '' && (belowKind !== 'basement-floor' || depth !== undefined),
  };
}

const ABOVE_DEFAULTS: Record<string, object> = {
  attic: { kind: 'attic', insulation: 'r30' },
  roof: { kind: 'roof', insulation: 'r30' },
  conditioned: { kind: 'conditioned' },
};
const BELOW_DEFAULTS: Record<string, object> = {
  slab: { kind: 'slab', edgeInsulated: false },
  crawlspace: { kind: 'crawlspace', vented: true, insulation: 'none' },
  basement: { kind: 'basement', insulation: 'none' },
  garage: { kind: 'garage', insulation: 'none' },
  'basement-floor': { kind: 'basement-floor', depthFt: 6, insulationR: 0 },
  conditioned: { kind: 'conditioned' },
};

/**
 * What is above the room (attic, roof, conditioned floor) and below it (slab, crawl, basement, garage, conditioned).
 * Re-renders when either changes.
 */
export const AboveBelowFields = memo(
  function AboveBelowFields({ draft, set, err }: EditorProps) {
    const above = asRecord(draft.above);
    const below = asRecord(draft.below);
    const aboveKind = asString(above.kind, 'conditioned');
    const belowKind = asString(below.kind, 'conditioned');
    return (
      <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
        <SelectInput
          label="Above the room"
          value={aboveKind}
          options={aboveOptions}
          onChange={(k) => set(['above'], ABOVE_DEFAULTS[k])}
          error={err(['above'])}
        />
        {aboveKind === 'attic' || aboveKind === 'roof' ? (
          <SelectInput
            label="Ceiling insulation"
            value={asString(above.insulation, 'r30')}
            options={ceilingInsulationOptions}
            onChange={(x) => set(['above', 'insulation'], x)}
            error={err(['above', 'insulation'])}
          />
        ) : null}
        {aboveKind === 'attic' || aboveKind === 'roof' ? (
          <SelectInput
            label="Roof colour"
            value={asString(above.roofColor, 'medium')}
            options={COLOR_OPTIONS}
            onChange={(x) => set(['above', 'roofColor'], x)}
            error={err(['above', 'roofColor'])}
          />
        ) : null}
        {aboveKind === 'attic' ? (
          <SelectInput
            label="Radiant barrier under the roof"
            value={above.radiantBarrier === true ? 'yes' : 'no'}
            options={[
              { value: 'no', label: 'No radiant barrier' },
              { value: 'yes', label: 'Radiant barrier' },
            ]}
            onChange={(x) => set(['above', 'radiantBarrier'], x === 'yes')}
          />
        ) : null}
        <SelectInput
          label="Below the room"
          value={belowKind}
          options={belowOptions}
          onChange={(k) => set(['below'], BELOW_DEFAULTS[k])}
          error={err(['below'])}
        />
        {belowKind === 'slab' ? (
          <SelectInput
            label="Slab edge"
            value={below.edgeInsulated === true ? 'yes' : 'no'}
            options={[
              { value: 'no', label: 'Edge not insulated' },
              { value: 'yes', label: 'Edge insulated' },
            ]}
            onChange={(x) => set(['below', 'edgeInsulated'], x === 'yes')}
          />
        ) : null}
        {belowKind === 'crawlspace' ? (
          <SelectInput
            label="Crawl space venting"
            value={below.vented === false ? 'closed' : 'vented'}
            options={[
              { value: 'vented', label: 'Vented' },
              { value: 'closed', label: 'Closed (sealed)' },
            ]}
            onChange={(x) => set(['below', 'vented'], x === 'vented')}
          />
        ) : null}
        {belowKind === 'basement-floor' ? (
          <>
            <NumberInput
              label="Floor depth below grade"
              quantity="ft"
              value={asNumber(below.depthFt)}
              onChange={(x) => set(['below', 'depthFt'], x)}
              error={err(['below', 'depthFt'])}
            />
            <NumberInput
              label="Basement’s shortest width"
              hint="The whole basement’s. Blank: this room’s shorter side."
              quantity="ft"
              value={asNumber(below.widthFt)}
              onChange={(x) => set(['below', 'widthFt'], x)}
              error={err(['below', 'widthFt'])}
            />
            <NumberInput
              label="Insulation under the floor"
              unit="R"
              value={asNumber(below.insulationR)}
              onChange={(x) => set(['below', 'insulationR'], x)}
              error={err(['below', 'insulationR'])}
            />
          </>
        ) : null}
        {belowKind === 'crawlspace' || belowKind === 'basement' || belowKind === 'garage' ? (
          <SelectInput
            label="Floor insulation"
            value={asString(below.insulation, 'none')}
            options={floorInsulationOptions}
            onChange={(x) => set(['below', 'insulation'], x)}
            error={err(['below', 'insulation'])}
          />
        ) : null}
      </div>
    );
  },
  sameDraftParts<EditorProps>(({ draft }) => [draft.above, draft.below]),
);
