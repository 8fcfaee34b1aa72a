import { randomUUID } from 'node:crypto';
import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { account, expectAccessible, jobWithRoomsNamed } from './desk-helpers';
import { DESKTOP, PHONE, SHOTS, signIn, startE2E, type E2E } from './harness';

let e: E2E;
beforeAll(async () => {
  e = await startE2E();
});
afterAll(async () => e?.close());

/**
 * The Larkspur ranch (invented demo data): five rooms. Units picked by hand as calc's suggestion sizes them for
 * the same zones (checked through the API below): two 15k slim ducted heads (the zones are closed rooms, so
 * ducted heads, with their lowest duct opening 7 ft up for the A2L room-size check) on the 30k four-port multi-zone
 * (since the measured flex-duct R of issue 9 raised the duct gains), and
 * calc's suggestion for the whole house (the 30k ducted heat pump with its air handler). Every unit is within its
 * sizing range, so the job is marked ready without the office's override (desk-ready covers the override).
 */
const RANCH = ['Great room', 'Kitchen and dining', 'Main bedroom', 'Bedroom two', 'Bedroom three'];
const ZONES = [
  { name: 'Great room and bedroom two', rooms: ['Great room', 'Bedroom two'], head: 'TSL-MH15-D', lengthFt: 25 },
  {
    name: 'Kitchen and bedrooms',
    rooms: ['Kitchen and dining', 'Main bedroom', 'Bedroom three'],
    head: 'TSL-MH15-D',
    lengthFt: 35,
  },
];
const MULTI = 'TSL-M30-4P';
/** Height of the zones' lowest duct opening above the floor, ft (ceiling grilles of an 8 ft room, less a foot). */
const OPENING_FT = 7;

interface SizingLike {
  withinRange: boolean;
  warnings: string[];
}

const tab = (page: Page, name: string) => page.getByRole('tab', { name: new RegExp(`^${name}`) });
const saved = (form: Locator) =>
  form
    .getByRole('status')
    .filter({ hasText: /^Saved$/ })
    .waitFor();

async function signedIn(role: string, viewport: { width: number; height: number } = DESKTOP) {
  const who = account(role);
  const { context, page } = await e.newPage(viewport);
  await signIn(page, who.email, who.password);
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
  return { context, page };
}

async function openDesk(page: Page, jobId: string) {
  await page.goto(`/jobs/${jobId}/desk`);
  await page.getByRole('region', { name: 'Ready to propose' }).waitFor();
}

/** Edits a takeoff line's quantity by `by` through its editor; the generated value then shows beside it. */
async function editQuantity(page: Page, description: string, by: number) {
  const takeoff = page.getByRole('region', { name: 'Materials and labor' });
  await takeoff.getByRole('button', { name: `Edit ${description}` }).click();
  const qty = takeoff.getByLabel(/^Quantity/);
  await qty.fill(String(Number(await qty.inputValue()) + by));
  await takeoff.getByRole('button', { name: 'Save line' }).click();
  await takeoff.getByRole('button', { name: `Edit ${description}` }).waitFor();
}

describe('the estimator’s desk to a ready job', () => {
  it('an estimator at 1440 px builds a multi-zone option by hand and a single-zone one with suggest, edits lines, regenerates, discounts within and beyond the limit, the owner approves one and denies another, and the job is marked ready', async () => {
    const { context, page } = await signedIn('estimator');
    const jobId = await jobWithRoomsNamed(page, RANCH);
    // The units size within range for these zones (calc's suggestion for the same zones names them).
    const rooms = (
      (await (await page.request.get(`/api/jobs/${jobId}/rooms`)).json()) as {
        rooms: { id: string; input: { name: string } }[];
      }
    ).rooms;
    const idOf = (n: string) => rooms.find((r) => r.input.name === n)?.id ?? n;
    const csrf = ((await (await page.request.get('/api/auth/csrf')).json()) as { token: string }).token;
    const suggested = (await (
      await page.request.post(`/api/jobs/${jobId}/suggest`, {
        headers: { 'X-CSRF-Token': csrf },
        data: {
          zones: ZONES.map((z, i) => ({
            key: `zone-${i + 1}`,
            name: z.name,
            roomIds: z.rooms.map(idOf),
            lowestDuctOpeningFt: OPENING_FT,
          })),
        },
      })
    ).json()) as { design: { zones: { indoorUnitKey: string }[]; systems: { outdoorUnitKey: string }[] } };
    // calc suggests the units the journey hangs by hand.
    expect(suggested.design.zones.map((z) => z.indoorUnitKey)).toEqual(ZONES.map((z) => z.head));
    expect(suggested.design.systems.map((s) => s.outdoorUnitKey)).toEqual([MULTI]);

    await openDesk(page, jobId);
    await expectAccessible(page);

    // ---- A multi-zone option by hand: two zones, one outdoor unit, a circuit to each.
    const whole = `Whole-home ${randomUUID().slice(0, 4)}`;
    await page.getByLabel('New option name').fill(whole);
    await page.getByRole('button', { name: 'Add option' }).click();
    await tab(page, whole).waitFor();
    const design = page.getByRole('form', { name: `Design of ${whole}` });
    await design.waitFor();
    await design.getByRole('button', { name: 'Add a zone' }).click();
    for (const [i, z] of ZONES.entries()) {
      const row = design.getByRole('group', { name: `Zone ${i + 1}`, exact: true });
      await row.getByLabel('Zone name').fill(z.name);
      for (const r of z.rooms)
        await row
          .getByRole('group', { name: `Rooms of zone ${i + 1}` })
          .getByLabel(r)
          .check();
      await row.getByLabel('Indoor unit', { exact: true }).selectOption(z.head);
      await row.getByLabel('Lowest duct opening above the floor (ft)').fill(String(OPENING_FT));
    }
    const system = design.getByRole('group', { name: 'System 1', exact: true });
    await system.getByLabel('Outdoor unit').selectOption(MULTI);
    await system.getByLabel('Branch circuit length (ft)').fill('30');
    await system.getByRole('button', { name: 'Add a circuit' }).click();
    for (const [i, z] of ZONES.entries()) {
      const circuit = system.getByRole('group', { name: `Circuit ${i + 1}`, exact: true });
      await circuit.getByLabel('Circuit to zone').selectOption(`zone-${i + 1}`);
      await circuit.getByLabel('Line-set length (ft)').fill(String(z.lengthFt));
    }
    await design.getByRole('button', { name: 'Save design' }).click();
    await saved(design);
    await page.getByText(/^2 of 4 ports used/).waitFor();
    // Slim ducted heads have ducts (here the walk-through's) but no heat kit: a heat kit goes in an air handler.
    const slimDucts = system.getByRole('group', { name: 'Ducts', exact: true });
    await slimDucts.getByLabel('Where the ducts run').waitFor();
    expect(await system.getByLabel('Heat kit (backup heat)').count()).toBe(0);
    await slimDucts.screenshot({ path: `${SHOTS}/desk-slim-ducts-1440.png` });

    // One line longer: the charge and the price follow.
    const charge = () => page.getByText(/^Total extra charge/).textContent();
    const price = page.getByRole('region', { name: 'Price' });
    const chargeBefore = await charge();
    const priceBefore = await price.textContent();
    const first = system.getByRole('group', { name: 'Circuit 1', exact: true }).getByLabel('Line-set length (ft)');
    await first.fill('50');
    await design.getByRole('button', { name: 'Save design' }).click();
    await saved(design);
    await expect.poll(charge).not.toBe(chargeBefore);
    await expect.poll(() => price.textContent()).not.toBe(priceBefore);

    // Takeoff lines edited: the generated value stays beside each.
    await editQuantity(page, 'Communication cable 14/4 stranded', 3);
    await editQuantity(page, 'Branch circuit, disconnect and whip', 1);
    const takeoff = page.getByRole('region', { name: 'Materials and labor' });
    await expect.poll(() => takeoff.getByText(/^generated /).count()).toBe(2);

    // A design change moves both generated quantities: both edits are listed; one is kept, one dropped.
    await first.fill('60');
    await system.getByLabel('Branch circuit length (ft)').fill('45');
    await design.getByRole('button', { name: 'Save design' }).click();
    await saved(design);
    await expect.poll(() => takeoff.getByRole('button', { name: 'Keep the edit' }).count()).toBe(2);
    await takeoff.screenshot({ path: `${SHOTS}/desk-stale-edits-1440.png` });
    await takeoff.getByRole('button', { name: 'Keep the edit' }).first().click();
    await expect.poll(() => takeoff.getByRole('button', { name: 'Keep the edit' }).count()).toBe(1);
    await takeoff.getByRole('button', { name: 'Drop it' }).click();
    await expect.poll(() => takeoff.getByRole('button', { name: 'Drop it' }).count()).toBe(0);
    await expect.poll(() => takeoff.getByText(/^generated /).count()).toBe(1);

    // ---- Pricing: a tax exemption needs its reason (said beside the field), an amount discount within the
    // estimator's 15 % applies, and 20 % more on top waits for the owner.
    const pricing = page.getByRole('form', { name: `Pricing of ${whole}` });
    await pricing.getByLabel('Tax for this option').selectOption('exempt');
    await pricing.getByRole('button', { name: 'Save pricing' }).click();
    await pricing.getByText('Enter a reason for the tax change').waitFor();
    await pricing.getByLabel('Reason for the tax change').fill('Exemption certificate on file');
    await pricing.getByRole('button', { name: 'Add a discount' }).click();
    const d1 = pricing.getByRole('group', { name: 'Discount 1', exact: true });
    await d1.getByLabel('Discount name').fill('Neighbour referral');
    await d1.getByLabel('Kind').selectOption('amount');
    await d1.getByLabel('Discount ($)').fill('250');
    await pricing.getByRole('button', { name: 'Save pricing' }).click();
    await saved(pricing);
    await price.getByText(/^Tax exempt — Exemption certificate on file/).waitFor();
    await price.getByText(/^Discounts \(/).waitFor();
    await pricing.getByRole('button', { name: 'Add a discount' }).click();
    const d2 = pricing.getByRole('group', { name: 'Discount 2', exact: true });
    await d2.getByLabel('Discount name').fill('Spring offer');
    await d2.getByLabel('Discount (%)').fill('20');
    await pricing.getByRole('button', { name: 'Save pricing' }).click();
    await page.getByText('Discount awaiting the owner’s approval').waitFor();
    await page.screenshot({ path: `${SHOTS}/desk-pricing-1440.png`, fullPage: true });
    await expectAccessible(page);

    // ---- A single-zone option with suggest: every room in one zone, then calc's units for it.
    const single = `Single-zone ${randomUUID().slice(0, 4)}`;
    await page.getByLabel('New option name').fill(single);
    await page.getByRole('button', { name: 'Add option' }).click();
    const design2 = page.getByRole('form', { name: `Design of ${single}` });
    await design2.waitFor();
    const zone = design2.getByRole('group', { name: 'Zone 1', exact: true });
    for (const r of RANCH) await zone.getByRole('group', { name: 'Rooms of zone 1' }).getByLabel(r).check();
    await zone.getByLabel('Indoor unit', { exact: true }).selectOption('TSL-S9H-W');
    const system2 = design2.getByRole('group', { name: 'System 1', exact: true });
    await system2.getByLabel('Outdoor unit').selectOption('TSL-S9H-O');
    await system2.getByLabel('Line-set length (ft)').fill('30');
    await system2.getByLabel('Branch circuit length (ft)').fill('30');
    await design2.getByRole('button', { name: 'Save design' }).click();
    await saved(design2);
    await page.getByRole('button', { name: 'Suggest units from the catalog' }).click();
    await page.getByText('Why these units').waitFor();
    await expect
      .poll(() =>
        page
          .getByRole('form', { name: `Design of ${single}` })
          .getByLabel('Indoor unit', { exact: true })
          .inputValue(),
      )
      .not.toBe('TSL-S9H-W');
    // The suggestion for the whole house as one zone of closed rooms: a ducted unit, never a wall head.
    await expect
      .poll(() =>
        page
          .getByRole('form', { name: `Design of ${single}` })
          .getByLabel('Indoor unit', { exact: true })
          .inputValue(),
      )
      .toBe('TSL-AH36');
    await page.screenshot({ path: `${SHOTS}/desk-suggested-1440.png`, fullPage: true });
    // Why these units: the pair's reason opens to the load and capacity it was judged on — the desk's own figures.
    const why = page.locator('details', { has: page.locator(':scope > summary', { hasText: 'Why these units' }) });
    await why.locator(':scope > summary').click();
    const pairWhy = why.locator('details', { has: page.locator(':scope > summary', { hasText: 'Suggested for' }) });
    await pairWhy.first().locator(':scope > summary').click();
    await pairWhy.getByText('Cooling load at design').waitFor();
    await why.screenshot({ path: `${SHOTS}/desk-suggested-why-1440.png` });
    await page.setViewportSize(PHONE);
    await why.screenshot({ path: `${SHOTS}/desk-suggested-why-375.png` });
    await page.setViewportSize(DESKTOP);
    // The suggested ducted pair sets no ducts of its own: the desk names the walk-through's it runs on.
    const suggestedDucts = page
      .getByRole('form', { name: `Design of ${single}` })
      .getByRole('group', { name: 'Ducts and backup heat' });
    await expect
      .poll(() => suggestedDucts.getByLabel('Where the ducts run').locator('option:checked').textContent())
      .toBe('The walk-through’s');
    await suggestedDucts.getByText(/^The walk-through’s ducts in the attic, R-6: their gains and losses/).waitFor();
    await suggestedDucts.screenshot({ path: `${SHOTS}/desk-suggested-ducts-1440.png` });
    // 40 % is beyond the estimator's limit: it waits too.
    const pricing2 = page.getByRole('form', { name: `Pricing of ${single}` });
    await pricing2.getByRole('button', { name: 'Add a discount' }).click();
    await pricing2.getByLabel('Discount name').fill('Clearance');
    await pricing2.getByLabel('Discount (%)').fill('40');
    await pricing2.getByRole('button', { name: 'Save pricing' }).click();
    await page.getByText('Discount awaiting the owner’s approval').waitFor();
    // Not ready while discounts wait: the reason is said.
    await page.getByRole('button', { name: 'Mark ready to propose' }).click();
    await page.getByText('A discount is waiting for the owner’s approval.').first().waitFor();

    // ---- The owner approves the first and denies the second.
    const owner = await signedIn('owner');
    await openDesk(owner.page, jobId);
    await tab(owner.page, whole).click();
    await owner.page.getByRole('button', { name: 'Approve discount' }).click();
    await owner.page.getByText(/^Discount approved by /).waitFor();
    await tab(owner.page, single).click();
    await owner.page.getByRole('button', { name: 'Deny' }).click();
    await owner.page.getByText(/^Discount denied by /).waitFor();
    await expectAccessible(owner.page);
    await owner.context.close();

    // ---- The estimator sees both decisions and marks the job ready.
    await openDesk(page, jobId);
    await tab(page, whole).click();
    await page.getByText(/^Discount approved by /).waitFor();
    await tab(page, single).click();
    await page.getByText(/^Discount denied by /).waitFor();
    // Every unit of both options is within its sizing range (calc's verdict on the desk): the mark is made at once,
    // with no reason asked for.
    const desk = (await (await page.request.get(`/api/jobs/${jobId}/desk`)).json()) as {
      options: { name: string; result: { zones: { sizing: SizingLike }[]; systems: { sizing: SizingLike }[] } }[];
    };
    for (const o of desk.options)
      for (const u of [...o.result.zones, ...o.result.systems])
        expect(u.sizing.withinRange, `${o.name}: ${u.sizing.warnings.join(' | ')}`).toBe(true);
    await page.getByRole('button', { name: 'Mark ready to propose' }).click();
    const ready = page.getByRole('region', { name: 'Ready to propose' });
    await ready
      .getByText(/^Ready to propose — marked by /)
      .waitFor()
      .catch(async (err: unknown) => {
        await page.screenshot({ path: `${SHOTS}/desk-ready-fail.png`, fullPage: true });
        const now = (await (await page.request.get(`/api/jobs/${jobId}/desk`)).json()) as { readiness: unknown };
        throw new Error(`not ready: ${JSON.stringify(now.readiness)}`, { cause: err });
      });
    expect(await ready.getByLabel('Why these sizes are right for this home').count()).toBe(0);
    const marked = (await (await page.request.get(`/api/jobs/${jobId}/desk`)).json()) as {
      readiness: { ready: boolean; sizingOverride: unknown };
    };
    expect(marked.readiness).toMatchObject({ ready: true, sizingOverride: null });
    await page.screenshot({ path: `${SHOTS}/desk-ready-1440.png`, fullPage: true });
    await expectAccessible(page);

    // ---- A third option, ducted: the ducts' loads and the heat kit's backup heat beside it.
    const ductedName = `Ducted ${randomUUID().slice(0, 4)}`;
    await page.getByLabel('New option name').fill(ductedName);
    await page.getByRole('button', { name: 'Add option' }).click();
    const design3 = page.getByRole('form', { name: `Design of ${ductedName}` });
    await design3.waitFor();
    const zone3 = design3.getByRole('group', { name: 'Zone 1', exact: true });
    for (const r of RANCH) await zone3.getByRole('group', { name: 'Rooms of zone 1' }).getByLabel(r).check();
    await zone3.getByLabel('Indoor unit', { exact: true }).selectOption('TSL-AH36');
    const system3 = design3.getByRole('group', { name: 'System 1', exact: true });
    await system3.getByLabel('Outdoor unit').selectOption('TSL-HP30');
    await system3.getByLabel('Line-set length (ft)').fill('25');
    await system3.getByLabel('Branch circuit length (ft)').fill('30');
    await system3.getByLabel('Where the ducts run').selectOption('attic');
    await system3.getByLabel('Duct insulation (R-value)').fill('8');
    await system3.getByLabel('Heat kit (backup heat)').selectOption('TSL-HK8');
    // A duct-leakage test's fractions and the heat kit's disconnect across the basement from the air handler.
    await system3.getByLabel('Tested supply leakage (fraction of airflow)').fill('0.06');
    await system3.getByLabel('Tested return leakage (fraction of airflow)').fill('0.04');
    await system3.getByLabel('Leakage test: date and method').fill('2026-11-12, leakage to outside at 25 Pa');
    await system3.getByLabel('Heat kit disconnect from the air handler (ft)').fill('12');
    await design3.getByRole('button', { name: 'Save design' }).click();
    await saved(design3);
    await page
      .getByText(/disconnect 60 A with 15 ft of liquid-tight conduit/)
      .first()
      .waitFor();
    await page
      .getByText(/a 6 ft whip does not reach/)
      .first()
      .waitFor();
    await page
      .getByText(/^Duct loads, /)
      .first()
      .waitFor();
    await system3.getByText('Backup heat needed at the design temperature').waitFor();
    // The heat kit's own run from the panel, not entered yet: the outdoor unit's 30 ft is assumed and said so.
    const kitBlock = page
      .getByRole('region', { name: 'System Outdoor unit 1' })
      .filter({ hasText: 'Electrical, heat kit' })
      .first();
    await kitBlock.getByText(/^Panel to air handler not entered: the heat kit's circuit is taken as 30 ft/).waitFor();
    await system3.getByLabel('Panel to air handler, heat kit circuit (ft)').fill('110');
    await design3.getByRole('button', { name: 'Save design' }).click();
    await saved(design3);
    await kitBlock.getByText(/voltage drop [\d.]+ % over 110 ft\b/).waitFor();
    expect(await kitBlock.getByText(/^Panel to air handler not entered/).count()).toBe(0);
    await kitBlock.screenshot({ path: `${SHOTS}/desk-ducted-results-1440.png` });
    // What the server stored is what the form shows: it still says "Saved", not "Not saved yet".
    expect(await design3.getByRole('status').textContent()).toBe('Saved');
    await design3.screenshot({ path: `${SHOTS}/desk-ducted-design-1440.png` });
    await expectAccessible(page);
    await page.setViewportSize({ width: 768, height: 1024 });
    await page.screenshot({ path: `${SHOTS}/desk-ducted-768.png`, fullPage: true });
    await page.setViewportSize(PHONE);
    await design3.screenshot({ path: `${SHOTS}/desk-ducted-design-375.png` });
    await kitBlock.screenshot({ path: `${SHOTS}/desk-ducted-results-375.png` });
    await tab(page, single).click();
    await page.screenshot({ path: `${SHOTS}/desk-suggested-375.png`, fullPage: true });
    await page.getByText(/^1 zone on 1 outdoor unit .*open to change$/).click();
    await suggestedDucts.screenshot({ path: `${SHOTS}/desk-suggested-ducts-375.png` });
    await tab(page, whole).click();
    // On a phone the pricing form folds to one line under its heading: a tap opens it.
    await page.getByRole('region', { name: 'Pricing' }).locator('summary').click();
    await page.getByRole('form', { name: `Pricing of ${whole}` }).screenshot({ path: `${SHOTS}/desk-pricing-375.png` });
    await context.close();
  });
});
