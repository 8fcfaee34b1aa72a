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

/** Pages checked so far in this run, by path with ids as ":id" (what a journey can say it covered). */
export const checkedPages = new Set<string>();

const pattern = (path: string) => path.replace(/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/g, ':id');

/**
 * The bar for every page a journey visits: no serious or critical WCAG 2 A/AA violation.
 * Returns the lesser findings so a journey may print them.
 */
export async function expectNoSeriousViolations(page: Page): Promise<AxeFinding[]> {
  const found = await axeViolations(page);
  const serious = found.filter((f) => f.impact === 'serious' || f.impact === 'critical');
  checkedPages.add(pattern(new URL(page.url()).pathname));
  if (serious.length > 0)
    throw new Error(`axe on ${new URL(page.url()).pathname}: ${JSON.stringify(serious, null, 2)}`);
  return found.filter((f) => !serious.includes(f));
}
