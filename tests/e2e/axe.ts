import axe from 'axe-core';
import type { Page } from 'playwright-core';

export interface AxeFinding {
  readonly id: string;
  readonly impact: string | null;
  readonly help: string;
  readonly targets: string[];
}

/**
 * Runs axe-core (injected from node_modules, nothing fetched) on the page as it stands and returns the
 * WCAG 2 A/AA violations, each with the elements it names, so a failing check says where to look.
 */
export async function axeViolations(page: Page): Promise<AxeFinding[]> {
  // Evaluated over the DevTools protocol: the app's Content-Security-Policy (script-src 'self') stays as it is.
  await page.evaluate(axe.source);
  return page.evaluate(async () => {
    const w = window as unknown as { axe: typeof import('axe-core') };
    const result = await w.axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa'] } });
    return result.violations.map((v) => ({
      id: v.id,
      impact: v.impact ?? null,
      help: v.help,
      targets: v.nodes.map((n) => n.target.join(' ')),
    }));
  });
}
