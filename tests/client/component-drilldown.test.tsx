import { homeLoad } from '@calc';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { ComponentDrilldown, drilldownRows } from '../../client/src/features/loads/components/component-drilldown';
import { ductLine } from '../../client/src/features/loads/components/home-totals';
import { ranchHome } from '../calc/ranch-home';

describe('a room’s component drill-down on the loads page', () => {
  const load = homeLoad({ home: { ...ranchHome, ducts: { location: 'attic', insulationR: 6 } } });
  const living = load.rooms.find((r) => r.roomId === 'living');

  it('opens to each part at the peak hour, with walls and windows by façade, and the parts add up to the total', () => {
    if (!living) throw new Error('the ranch has a living room');
    render(<ComponentDrilldown load={living} />);
    const summary = screen.getByText(/What makes up the peak/);
    fireEvent.click(summary);
    const table = screen.getByRole('table');
    expect(within(table).getAllByText('facing south')).toHaveLength(2); // its wall and its windows
    expect(within(table).getAllByText('facing south')[0]).toBeVisible();
    expect(within(table).getByText('Ducts')).toBeVisible();
    const rows = drilldownRows(living);
    const top = rows.filter((r) => !r.sub).reduce((s, r) => s + r.sensible, 0);
    expect(top).toBe(living.sensibleGain.total);
    const heat = rows.filter((r) => !r.sub).reduce((s, r) => s + (r.heat ?? 0), 0);
    expect(heat).toBe(living.heatLoss.total);
    // the façade rows of windows add up to the windows row
    const i = rows.findIndex((r) => r.label === 'Windows');
    const windows = rows[i]?.sensible ?? 0;
    const after = rows.slice(i + 1);
    const end = after.findIndex((r) => !r.sub);
    const facades = after.slice(0, end);
    expect(facades.length).toBe(2); // south and west glass
    expect(facades.reduce((s, r) => s + r.sensible, 0)).toBe(windows);
  });

  it('says what the ducts add, where they run and the method', () => {
    if (!load.ducts) throw new Error('the home has ducts');
    const line = ductLine(load.ducts);
    expect(line).toContain(
      `Ducts in the attic (R-6 insulation, working as R-${load.ducts.supplyEffectiveR} supply / R-${load.ducts.returnEffectiveR} return, leakage 10 % supply / 10 % return`,
    );
    expect(line).toContain(`+${load.ducts.heating.btuh.toLocaleString('en-US')} Btu/h heat loss`);
    expect(line).toContain('ASHRAE Standard 152');
  });
});
