import { act, fireEvent, render, screen } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { OptionRecord, TakeoffLineRecord } from '@contract';
import { formatMoney } from '@calc';
import { DeskFold } from '../../client/src/features/desk/components/desk-fold';
import { TakeoffGroups } from '../../client/src/features/desk/components/takeoff-phone';
import { UnitWhys } from '../../client/src/features/desk/components/unit-whys';
import type { ExplanationView } from '../../client/src/features/desk/model/result-view';

/** The window's width as the media query sees it (happy-dom's own matchMedia is swapped for one we steer). */
let width = 1440;
beforeEach(() => {
  vi.stubGlobal('matchMedia', (query: string) => {
    const max = Number(/max-width:\s*([\d.]+)px/.exec(query)?.[1] ?? Infinity);
    return {
      matches: width <= max,
      media: query,
      addEventListener: () => undefined,
      removeEventListener: () => undefined,
    };
  });
});
afterEach(() => vi.unstubAllGlobals());

/** Opens a native fold as a tap does: the browser sets `open`, then fires `toggle`. */
function tap(summary: HTMLElement) {
  const details = summary.closest('details');
  if (!details) throw new Error('not a fold');
  act(() => {
    details.open = !details.open;
    fireEvent(details, new Event('toggle'));
  });
}

describe('DeskFold', () => {
  it('starts folded on a phone and draws its content only once opened; a form inside stays mounted', () => {
    width = 375;
    render(
      <>
        <DeskFold summary={<span>Figures</span>}>
          <p>the figures</p>
        </DeskFold>
        <DeskFold keepMounted summary={<span>Design</span>}>
          <input aria-label="Zone name" defaultValue="typed" />
        </DeskFold>
      </>,
    );
    expect(screen.queryByText('the figures')).toBeNull();
    expect(screen.getByText('Figures').closest('details')?.open).toBe(false);
    // Folded but mounted: what was typed is still there when it opens.
    expect(screen.getByLabelText('Zone name')).toHaveProperty('value', 'typed');
    tap(screen.getByText('Figures'));
    expect(screen.getByText('the figures')).toBeTruthy();
  });

  it('starts open on a desk-width screen', () => {
    width = 1440;
    render(
      <DeskFold summary={<span>Figures</span>}>
        <p>the figures</p>
      </DeskFold>,
    );
    expect(screen.getByText('Figures').closest('details')?.open).toBe(true);
    expect(screen.getByText('the figures')).toBeTruthy();
  });
});

const line = (itemKey: string, category: TakeoffLineRecord['category'], sellCents?: number): TakeoffLineRecord => ({
  itemKey,
  description: `Item ${itemKey}`,
  unit: 'each',
  category,
  derivation: `how ${itemKey} was counted`,
  quantity: 2,
  generatedQuantity: 2,
  edited: false,
  source: 'generated',
  ...(sellCents === undefined ? {} : { sellCents, unitCostCents: 100, extendedCostCents: 200 }),
});

describe('the takeoff on a phone', () => {
  const option = { id: 'o1', takeoffEdits: [] } as unknown as OptionRecord;

  it('is one line per category with its count and the sum of its lines’ sell prices, each opening to its lines', () => {
    width = 375;
    const lines = [line('a', 'equipment', 250_000), line('b', 'material', 1_234), line('c', 'material', 5_678)];
    render(<TakeoffGroups jobId="j1" option={option} lines={lines} canEdit={false} editing={null} onEdit={() => {}} />);
    const materials = screen.getByText('Materials').closest('summary');
    if (!materials) throw new Error('no Materials line');
    expect(materials.textContent).toContain('2 lines');
    expect(materials.textContent).toContain(`${formatMoney(1_234 + 5_678)} sell`);
    expect(screen.getByText('Equipment').closest('summary')?.textContent).toContain('1 line');
    expect(screen.queryByText('Item b')).toBeNull();
    tap(materials);
    // Each line folded to its item, quantity and sell; its derivation only once it is opened.
    expect(screen.getByText('Item b')).toBeTruthy();
    expect(screen.queryByText('how b was counted')).toBeNull();
    tap(screen.getByText('Item b'));
    expect(screen.getByText('how b was counted')).toBeTruthy();
  });

  it('shows no money where the role sees none (a salesperson’s lines carry no prices)', () => {
    width = 375;
    render(
      <TakeoffGroups
        jobId="j1"
        option={option}
        lines={[line('a', 'labor'), line('b', 'labor')]}
        canEdit={false}
        editing={null}
        onEdit={() => {}}
      />,
    );
    const labor = screen.getByText('Labor').closest('summary');
    expect(labor?.textContent).toContain('2 lines');
    expect(labor?.textContent).not.toContain('$');
  });
});

const why = (key: string, verdict: string, valueText = '99 %'): ExplanationView => ({
  key,
  label: `Sizing, ${key.split(':')[0]}`,
  valueText,
  text: '24,000 Btu/h ÷ 24,242 Btu/h = 99 %',
  inputs: [],
  verdict,
  status: 'ok',
});

describe('a unit’s verdicts', () => {
  const within = 'cooling 99 % of the load: within the 90–130 % range';

  it('are said once for an indoor unit alone on its outdoor unit, where the pair says the same', () => {
    width = 375;
    render(
      <UnitWhys
        name="Whole house"
        whys={[why('z1:cooling-ratio', within)]}
        pairedWith={{ name: 'Whole house system', whys: [why('s1:cooling-ratio', within)] }}
      />,
    );
    expect(screen.getByText(/the verdicts stand under Whole house system below/)).toBeTruthy();
    expect(screen.queryByText(/^Cooling 99 %/)).toBeNull();
  });

  it('stay beside the indoor unit when the pair’s differ', () => {
    width = 375;
    render(
      <UnitWhys
        name="Whole house"
        whys={[why('z1:cooling-ratio', within)]}
        pairedWith={{ name: 'Whole house system', whys: [why('s1:cooling-ratio', within, '98 %')] }}
      />,
    );
    expect(screen.getByText(/^Cooling 99 % of the load: within/)).toBeTruthy();
    expect(screen.queryByText(/stand under/)).toBeNull();
  });
});
