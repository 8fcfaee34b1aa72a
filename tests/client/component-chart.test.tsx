import type { LoadComponents } from '@calc';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';

afterEach(() => vi.restoreAllMocks());
import { ComponentChart } from '../../client/src/features/loads/components/component-chart';
import { COMPONENT_KEYS } from '../../client/src/features/loads/model/compute';

const each = (f: (i: number) => number): LoadComponents => {
  const parts = Object.fromEntries(COMPONENT_KEYS.map((k, i) => [k, f(i)])) as Record<
    (typeof COMPONENT_KEYS)[number],
    number
  >;
  return { ...parts, total: Object.values(parts).reduce((a, b) => a + b, 0) };
};

describe('a room’s load chart', () => {
  it('is a named figure with its figures in a table, and is no keyboard stop', () => {
    // jsdom lays nothing out: give the chart's box a size so the drawing is really made
    vi.spyOn(HTMLElement.prototype, 'getBoundingClientRect').mockReturnValue(new DOMRect(0, 0, 600, 300));
    const { container } = render(
      <ComponentChart
        roomName="Bedroom 2"
        sensible={each((i) => 1000 + i)}
        latent={each(() => 10)}
        heatLoss={each((i) => 2000 + i)}
        ducts
      />,
    );
    const figure = screen.getByRole('figure', { name: "Where Bedroom 2's load comes from" });
    // the drawing is there (so the tab-stop check below looks at it) and holds nothing focusable
    expect(container.querySelector('svg')).not.toBeNull();
    expect(container.querySelectorAll('[tabindex]:not([tabindex="-1"])')).toHaveLength(0);
    const table = within(figure).getByRole('table', { name: "Where Bedroom 2's load comes from, Btu/h" });
    const rows = within(table).getAllByRole('row');
    expect(rows).toHaveLength(COMPONENT_KEYS.length + 1);
    // first component: 1000 sensible + 10 latent = 1,010 Btu/h cooling; 2,000 Btu/h heat loss
    expect(rows[1]).toHaveTextContent('1,010 Btu/h');
    expect(rows[1]).toHaveTextContent('2,000 Btu/h');
  });

  it('has no Ducts row unless a ducted system serves the home', () => {
    render(<ComponentChart sensible={each(() => 1)} latent={each(() => 0)} heatLoss={each(() => 1)} />);
    const names = [...document.querySelectorAll('th[scope="row"]')].map((th) => th.textContent);
    expect(names).toHaveLength(COMPONENT_KEYS.length - 1);
    expect(names).not.toContain('Ducts');
  });
});

/** WCAG 2.x relative luminance and contrast ratio (https://www.w3.org/TR/WCAG21/#dfn-contrast-ratio). */
function luminance(hex: string): number {
  const [r, g, b] = [1, 3, 5].map((i) => {
    const c = parseInt(hex.slice(i, i + 2), 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  }) as [number, number, number];
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}
const contrast = (a: string, b: string) => {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x) as [number, number];
  return (hi + 0.05) / (lo + 0.05);
};

describe('chart colours', () => {
  const css = readFileSync(resolve(process.cwd(), 'client/src/styles.css'), 'utf8');
  const token = (name: string) => css.match(new RegExp(`--color-${name}:\\s*(#[0-9a-f]{6})`, 'i'))?.[1] ?? '';

  it('cooling and heating are ≥ 3:1 on white and on paper (WCAG 2.1 SC 1.4.11, non-text contrast)', () => {
    expect(contrast('#ffffff', '#000000')).toBeCloseTo(21, 5); // the formula's own end point
    for (const name of ['cooling', 'heating']) {
      expect(token(name)).toMatch(/^#/);
      expect(contrast(token(name), '#ffffff')).toBeGreaterThanOrEqual(3);
      expect(contrast(token(name), token('paper'))).toBeGreaterThanOrEqual(3);
    }
  });

  it('cooling is a cool colour (blue wins) and heating a warm one (red wins)', () => {
    const rgb = (hex: string) => [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16)) as [number, number, number];
    const [cr, , cb] = rgb(token('cooling'));
    const [hr, , hb] = rgb(token('heating'));
    expect(cb).toBeGreaterThan(cr);
    expect(hr).toBeGreaterThan(hb);
  });
});
