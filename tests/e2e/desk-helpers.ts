import type { Page } from 'playwright-core';
import { expect } from 'vitest';
import { demoAccounts } from '../../fixtures/seed';
import { axeViolations } from './axe';

/** The desk journeys' shared steps (tests/e2e/desk*.test.ts). */

export const account = (role: string) => {
  const a = demoAccounts.find((x) => x.role === role && x.company.startsWith('Larkspur'));
  if (!a) throw new Error(`no demo ${role}`);
  return a;
};

/**
 * A demo job with rooms and no options (the journey builds its own). When every such job already holds
 * options (an earlier run on the same database), the newest one's options are deleted through the API.
 */
export async function jobWithRooms(page: Page): Promise<string> {
  const list = (await (await page.request.get('/api/jobs?page=1&pageSize=50')).json()) as {
    items: { id: string; status: string }[];
  };
  const candidates: { id: string; options: { id: string; version: number }[] }[] = [];
  for (const j of list.items) {
    if (j.status !== 'walkthrough' && j.status !== 'design') continue;
    const rooms = (await (await page.request.get(`/api/jobs/${j.id}/rooms`)).json()) as { rooms: unknown[] };
    const desk = (await (await page.request.get(`/api/jobs/${j.id}/desk`)).json()) as {
      options: { id: string; version: number }[];
    };
    if (rooms.rooms.length === 0) continue;
    if (desk.options.length === 0) return j.id;
    candidates.push({ id: j.id, options: desk.options });
  }
  const reuse = candidates[0];
  if (!reuse) throw new Error('no demo job with rooms');
  const csrf = ((await (await page.request.get('/api/auth/csrf')).json()) as { token: string }).token;
  for (const o of reuse.options) {
    const gone = await page.request.delete(`/api/jobs/${reuse.id}/options/${o.id}`, {
      headers: { 'X-CSRF-Token': csrf, 'If-Match': `"${o.version}"` },
    });
    expect(gone.status(), await gone.text()).toBe(204);
  }
  return reuse.id;
}

export async function expectAccessible(page: Page) {
  const found = await axeViolations(page);
  expect(found, JSON.stringify(found, null, 2)).toEqual([]);
}

/** Picks the first real choice of a select (the first option is the "Choose …" prompt). */
export async function pickFirst(page: Page, label: string) {
  const select = page.getByLabel(label).first();
  const values = await select.locator('option').evaluateAll((os) => os.map((o) => (o as HTMLOptionElement).value));
  const value = values.find((v) => v !== '');
  if (!value) throw new Error(`nothing to choose in ${label}`);
  await select.selectOption(value);
}

/**
 * The demo job whose rooms carry these names (the Larkspur ranch: five rooms), its options from an earlier run
 * on the same database deleted through the API, so the journey starts from no options.
 */
export async function jobWithRoomsNamed(page: Page, names: readonly string[]): Promise<string> {
  const list = (await (await page.request.get('/api/jobs?page=1&pageSize=50')).json()) as {
    items: { id: string; status: string }[];
  };
  for (const j of list.items) {
    if (j.status !== 'walkthrough' && j.status !== 'design') continue;
    const rooms = (await (await page.request.get(`/api/jobs/${j.id}/rooms`)).json()) as {
      rooms: { input: { name?: unknown } }[];
    };
    const have = new Set(rooms.rooms.map((r) => r.input.name));
    if (!names.every((n) => have.has(n))) continue;
    const desk = (await (await page.request.get(`/api/jobs/${j.id}/desk`)).json()) as {
      options: { id: string; version: number }[];
    };
    const csrf = ((await (await page.request.get('/api/auth/csrf')).json()) as { token: string }).token;
    for (const o of desk.options) {
      const gone = await page.request.delete(`/api/jobs/${j.id}/options/${o.id}`, {
        headers: { 'X-CSRF-Token': csrf, 'If-Match': `"${o.version}"` },
      });
      expect(gone.status(), await gone.text()).toBe(204);
    }
    return j.id;
  }
  throw new Error(`no demo job with rooms ${names.join(', ')}`);
}

/**
 * The page fits the viewport: no sideways scroll of the whole page (a select's longest model name or a wide
 * table once made the desk 507 px wide at 375), and the takeoff reads as stacked lines, not a table to scroll.
 */
export async function expectFitsWidth(page: Page) {
  const widths = await page.evaluate(() => {
    const takeoff = document.querySelector('section[aria-label="Materials and labor"] table');
    return {
      page: document.documentElement.scrollWidth,
      viewport: document.documentElement.clientWidth,
      takeoff: takeoff ? takeoff.scrollWidth - (takeoff.parentElement?.clientWidth ?? 0) : 0,
    };
  });
  expect(widths.page, `the page is ${widths.page} px wide in a ${widths.viewport} px window`).toBeLessThanOrEqual(
    widths.viewport,
  );
  expect(widths.takeoff, 'the takeoff is wider than its card').toBeLessThanOrEqual(0);
}
