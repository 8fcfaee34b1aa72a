import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts } from '../../fixtures/seed';
import { expectNoSeriousViolations } from './axe';
import { DESKTOP, PHONE, SHOTS, signIn, startE2E, type E2E } from './harness';

let e: E2E;
beforeAll(async () => {
  e = await startE2E();
});
afterAll(async () => e?.close());

// What each role's main navigation must and must not offer.
const navFor: Record<string, { shows: string[]; hides: string[] }> = {
  owner: { shows: ['Jobs', 'Users', 'Reports'], hides: [] },
  estimator: { shows: ['Jobs'], hides: ['Users', 'Reports'] },
  salesperson: { shows: ['Jobs'], hides: ['Users', 'Reports'] },
  installer: { shows: ['Jobs'], hides: ['Users', 'Reports'] },
};

describe('sign in as every demo role, see the right navigation, sign out', () => {
  for (const viewport of [PHONE, DESKTOP]) {
    for (const account of demoAccounts.filter((a) => a.company === demoAccounts[0]?.company)) {
      it(`${account.role} at ${viewport.width} px`, async () => {
        const { context, page } = await e.newPage(viewport);
        await signIn(page, account.email, account.password);
        await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
        await page.getByTestId('user-name').first().waitFor();
        // At phone width the main navigation sits behind the Menu button.
        if (viewport.width < 768) await page.getByRole('button', { name: /menu/i }).click();
        const nav = page.getByRole('navigation', { name: 'Main' });
        const rule = navFor[account.role];
        if (!rule) throw new Error(`no rule for ${account.role}`);
        for (const label of rule.shows)
          await nav.getByRole('link', { name: label, exact: true }).waitFor({ state: 'visible' });
        for (const label of rule.hides)
          expect(await nav.getByRole('link', { name: label, exact: true }).count()).toBe(0);
        await page.screenshot({ path: `${SHOTS}/home-${account.role}-${viewport.width}.png`, fullPage: true });
        // Each role's start page (menu open on a phone) has no serious or critical accessibility finding.
        await expectNoSeriousViolations(page);
        await page.getByRole('button', { name: 'Sign out' }).first().click();
        await page.waitForURL((u) => u.pathname.startsWith('/sign-in'));
        const me = await page.request.get('/api/auth/me');
        expect(me.status()).toBe(401);
        await context.close();
      });
    }
  }

  it('shows one clear message for a wrong password', async () => {
    const { context, page } = await e.newPage(PHONE);
    const first = demoAccounts[0];
    if (!first) throw new Error('no demo accounts');
    await signIn(page, first.email, 'definitely-not-it');
    await page.getByText('The e-mail or password is not right.').waitFor();
    await page.screenshot({ path: `${SHOTS}/sign-in-error-375.png` });
    await expectNoSeriousViolations(page);
    await context.close();
  });
});
