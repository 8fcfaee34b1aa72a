import { randomUUID } from 'node:crypto';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { account, expectAccessible, expectFitsWidth, jobWithRooms, pickFirst } from './desk-helpers';
import { DESKTOP, PHONE, SHOTS, signIn, startE2E, type E2E } from './harness';

let e: E2E;
beforeAll(async () => {
  e = await startE2E();
});
afterAll(async () => e?.close());

describe('the estimator’s desk', () => {
  it('an estimator at 1440 px builds an option, sees the charge change with the line length, prices it, a discount beyond the limit waits for the owner, copies it and compares', async () => {
    const est = account('estimator');
    const { context, page } = await e.newPage(DESKTOP);
    await signIn(page, est.email, est.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    const jobId = await jobWithRooms(page);
    await page.goto(`/jobs/${jobId}/desk`);
    await page.getByText('No options yet').waitFor();
    await expectAccessible(page);

    const name = `Essential ${randomUUID().slice(0, 4)}`;
    await page.getByLabel('New option name').fill(name);
    await page.getByRole('button', { name: 'Add option' }).click();
    await page.getByRole('tab', { name: new RegExp(name) }).waitFor();

    const design = page.getByRole('form', { name: /^Design of/ });
    // Design: every room in one zone, a single-zone outdoor unit, a 25 ft run.
    const rooms = page.getByRole('group', { name: 'Rooms of zone 1' }).getByRole('checkbox');
    for (const box of await rooms.all()) await box.check();
    await pickFirst(page, 'Indoor unit');
    await pickFirst(page, 'Outdoor unit');
    await page.getByLabel('Line-set length (ft)').fill('25');
    await page.getByLabel('Branch circuit length (ft)').fill('30');
    await page.getByRole('button', { name: 'Save design' }).click();
    await design
      .getByRole('status')
      .filter({ hasText: /^Saved$/ })
      .waitFor();
    const charge = page.getByText(/extra charge/).first();
    await charge.waitFor();
    const before = await page.getByText(/^Total extra charge/).textContent();

    await page.getByLabel('Line-set length (ft)').fill('60');
    await design.getByRole('status').filter({ hasText: 'Not saved yet' }).waitFor();
    await page.getByRole('button', { name: 'Save design' }).click();
    await design
      .getByRole('status')
      .filter({ hasText: /^Saved$/ })
      .waitFor();
    await expect.poll(() => page.getByText(/^Total extra charge/).textContent()).not.toBe(before);
    // The charge opens to its why.
    await page.getByText('why?').first().click();
    await page.screenshot({ path: `${SHOTS}/desk-design-1440.png`, fullPage: true });
    await expectAccessible(page);

    // A takeoff line edited: the generated value stays beside the edited one.
    const takeoff = page.getByRole('region', { name: 'Materials and labor' });
    await takeoff
      .getByRole('button', { name: /^Edit / })
      .first()
      .click();
    const qty = takeoff.getByLabel(/^Quantity/);
    await qty.fill(String(Number(await qty.inputValue()) + 2));
    await takeoff.getByRole('button', { name: 'Save line' }).click();
    await takeoff
      .getByText(/^generated /)
      .first()
      .waitFor();

    const pricing = page.getByRole('form', { name: /^Pricing of/ });
    // Pricing: 5 % within the estimator's limit applies; 40 % beyond it waits for the owner.
    const totalBefore = await page.getByRole('tab', { name: new RegExp(name) }).textContent();
    await page.getByRole('button', { name: 'Add a discount' }).click();
    await page.getByLabel('Discount name').fill('Neighbour referral');
    await page.getByLabel('Discount (%)').last().fill('5');
    await page.getByRole('button', { name: 'Save pricing' }).click();
    await pricing
      .getByRole('status')
      .filter({ hasText: /^Saved$/ })
      .waitFor();
    await expect.poll(() => page.getByRole('tab', { name: new RegExp(name) }).textContent()).not.toBe(totalBefore);
    await page.getByLabel('Discount (%)').last().fill('40');
    await page.getByRole('button', { name: 'Save pricing' }).click();
    await page
      .getByText('Discount awaiting the owner’s approval')
      .waitFor()
      .catch(async (err: unknown) => {
        await page.screenshot({ path: `${SHOTS}/desk-fail.png`, fullPage: true });
        throw err;
      });

    // Copy, then the two side by side.
    await page.getByLabel('Name of the copy').fill(`${name} copy`);
    await page.getByRole('button', { name: 'Copy this option' }).click();
    await page.getByRole('tab', { name: new RegExp(`${name} copy`) }).waitFor();
    await page.getByRole('heading', { name: 'Options side by side' }).waitFor();

    // The copy takes calc's suggestion from the catalog, with why each unit was chosen.
    await page.getByRole('tab', { name: new RegExp(`${name} copy`) }).click();
    await page.getByRole('button', { name: 'Suggest units from the catalog' }).click();
    await page.getByText('Why these units').waitFor();

    // Not ready while the discount waits: the reason is said.
    await page.getByRole('button', { name: 'Mark ready to propose' }).click();
    await page.getByText('A discount is waiting for the owner’s approval.').first().waitFor();
    await page.screenshot({ path: `${SHOTS}/desk-1440.png`, fullPage: true });
    await expectAccessible(page);

    await page.setViewportSize({ width: 768, height: 1024 });
    await page.screenshot({ path: `${SHOTS}/desk-768.png`, fullPage: true });
    await expectFitsWidth(page);
    await page.setViewportSize(PHONE);
    await page.screenshot({ path: `${SHOTS}/desk-375.png`, fullPage: true });
    // The estimator's own desk on a phone: the design form, the takeoff and the comparison fit 375 px.
    await expectFitsWidth(page);
    await expectAccessible(page);
    await context.close();
  });
});

/**
 * Through the API as the estimator: a fresh option on a demo job with rooms (all rooms in one zone, the
 * catalog's first indoor and single-zone outdoor unit), and the job handed to the demo installer, so the
 * salesperson (whose job it is) and the installer both reach it.
 */
async function officeOption(page: Page): Promise<string> {
  const jobId = await jobWithRooms(page);
  const csrf = ((await (await page.request.get('/api/auth/csrf')).json()) as { token: string }).token;
  const headers = { 'X-CSRF-Token': csrf };
  const rooms = ((await (await page.request.get(`/api/jobs/${jobId}/rooms`)).json()) as { rooms: { id: string }[] })
    .rooms;
  const models = (
    (await (await page.request.get('/api/company-data/models')).json()) as {
      rows: { key: string; record: { kind: string } }[];
    }
  ).rows;
  const indoor = models.find((m) => m.record.kind === 'indoor')?.key;
  const outdoor = models.find((m) => m.record.kind === 'outdoor-single-zone')?.key;
  const design = {
    zones: [{ key: 'zone-1', name: 'Whole house', roomIds: rooms.map((r) => r.id), indoorUnitKey: indoor }],
    systems: [
      {
        key: 'sys-1',
        name: 'Outdoor unit',
        outdoorUnitKey: outdoor,
        circuits: [{ zoneKey: 'zone-1', lengthFt: 25 }],
        electrical: { circuitLengthFt: 30 },
      },
    ],
  };
  for (const name of ['Essential', 'Quiet comfort']) {
    const made = await page.request.post(`/api/jobs/${jobId}/options`, { headers, data: { name, design } });
    expect(made.status(), await made.text()).toBe(201);
  }
  const staff = ((await (await page.request.get('/api/staff')).json()) as { staff: { id: string; role: string }[] })
    .staff;
  const job = ((await (await page.request.get(`/api/jobs/${jobId}`)).json()) as { job: { version: number } }).job;
  const assigned = await page.request.patch(`/api/jobs/${jobId}`, {
    headers: { ...headers, 'If-Match': `"${job.version}"` },
    data: { assignedInstallerId: staff.find((p) => p.role === 'installer')?.id },
  });
  expect(assigned.status(), await assigned.text()).toBe(200);
  return jobId;
}

describe('the desk per role, on a phone', () => {
  it('a salesperson sees the price and no cost; an installer sees the equipment and no money', async () => {
    const office = await e.newPage(DESKTOP);
    const est = account('estimator');
    await signIn(office.page, est.email, est.password);
    await office.page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    const jobId = await officeOption(office.page);
    await office.context.close();
    for (const role of ['salesperson', 'installer'] as const) {
      const who = account(role);
      const { context, page } = await e.newPage(PHONE);
      await signIn(page, who.email, who.password);
      await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
      await page.goto(`/jobs/${jobId}/desk`);
      await page.getByRole('tablist', { name: 'Options' }).waitFor();
      await page.getByRole('region', { name: 'Equipment, lines and charge, electrical' }).waitFor();
      expect(await page.getByText('Equipment cost').count()).toBe(0);
      expect(await page.getByText('Gross margin').count()).toBe(0);
      if (role === 'salesperson')
        await page.getByRole('region', { name: 'Price' }).getByText('Total', { exact: true }).waitFor();
      else expect(await page.getByRole('region', { name: 'Price' }).count()).toBe(0);
      expect(await page.getByRole('form', { name: /^Pricing of/ }).count()).toBe(0);
      await page.screenshot({ path: `${SHOTS}/desk-${role}-375.png`, fullPage: true });
      await expectFitsWidth(page);
      await expectAccessible(page);
      await context.close();
    }
  });
});

describe('a first price before leaving', () => {
  it('a salesperson at 375 px taps "First price" after the walk-through and gets a range marked preliminary', async () => {
    const sales = account('salesperson');
    const { context, page } = await e.newPage(PHONE);
    await signIn(page, sales.email, sales.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    const jobId = await jobWithRooms(page);
    await page.goto(`/jobs/${jobId}`);
    const panel = page.getByRole('region', { name: 'First price' });
    await panel.getByRole('button', { name: 'First price' }).click();
    await panel.getByText('Preliminary', { exact: true }).waitFor();
    await panel.getByText(/^about \$/i).waitFor();
    await panel.scrollIntoViewIfNeeded();
    await page.screenshot({ path: `${SHOTS}/first-price-375.png` });
    await expectAccessible(page);
    const desk = (await (await page.request.get(`/api/jobs/${jobId}/desk`)).json()) as {
      options: { preliminary: boolean }[];
    };
    expect(desk.options.map((o) => o.preliminary)).toEqual([true]);
    await context.close();

    // The office reviews it: the preliminary mark goes and the desk says who reviewed it and when.
    const est = account('estimator');
    const office = await e.newPage(DESKTOP);
    await signIn(office.page, est.email, est.password);
    await office.page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    await office.page.goto(`/jobs/${jobId}/desk`);
    await office.page.getByText('Preliminary', { exact: true }).waitFor();
    await office.page.getByRole('button', { name: 'Review first price' }).click();
    await office.page.getByText(/^First price from the walk-through, reviewed by .+ on /).waitFor();
    expect(await office.page.getByRole('button', { name: 'Review first price' }).count()).toBe(0);
    await expectAccessible(office.page);
    await office.context.close();
  });
});
