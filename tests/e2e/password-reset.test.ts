import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts } from '../../fixtures/seed';
import type { StoredMail } from '../../server/src/fakes/smtp-fake';
import { checkedPages, expectNoSeriousViolations } from './axe';
import { PHONE, SHOTS, signIn, startE2E, type E2E } from './harness';

let e: E2E;
beforeAll(async () => {
  e = await startE2E();
});
afterAll(async () => e?.close());

/** The newest message to `to` whose subject matches, as the SMTP fake received it (bounded wait). */
async function mailFor(to: string, subject: RegExp): Promise<StoredMail> {
  for (let i = 0; i < 100; i += 1) {
    const found = e.smtp.messages.filter((m) => m.to.includes(to) && subject.test(m.subject)).at(-1);
    if (found) return found;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`no mail to ${to} matching ${subject}`);
}

describe('a person who forgot their password', () => {
  it('asks for a link, reads the e-mail, sets a new password and signs in (375 px)', async () => {
    const owner = demoAccounts.find((a) => a.role === 'owner');
    if (!owner) throw new Error('no demo owner');
    const email = `reset-journey-${Date.now()}@larkspur-demo.example.com`;
    const name = 'Rowan Quillfeather';

    // The owner adds the person (their own account, so the demo passwords stay as they are).
    const office = await e.newPage(PHONE);
    await signIn(office.page, owner.email, owner.password);
    await office.page.getByTestId('user-name').first().waitFor();
    await office.page.goto('/users');
    const add = office.page.getByRole('form', { name: 'Add a user' });
    await expectNoSeriousViolations(office.page);
    await add.getByLabel('Name').fill(name);
    await add.getByLabel('E-mail').fill(email);
    await add.getByLabel('First password').fill('first-password-from-owner');
    await add.getByRole('button', { name: 'Add user' }).click();
    await office.page.getByText(`${name} can now sign in.`).waitFor();

    // On their phone: sign-in page → "Forgot your password?"
    const phone = await e.newPage(PHONE);
    await phone.page.goto('/sign-in');
    await phone.page.getByRole('link', { name: 'Forgot your password?' }).waitFor();
    await expectNoSeriousViolations(phone.page);
    await phone.page.getByRole('link', { name: 'Forgot your password?' }).click();
    await phone.page.getByRole('heading', { name: 'Forgot your password?' }).waitFor();
    await phone.page.getByLabel('E-mail').fill(email);
    await phone.page.screenshot({ path: `${SHOTS}/forgot-password-375.png`, fullPage: true });
    await expectNoSeriousViolations(phone.page);
    await phone.page.getByRole('button', { name: 'Send me a link' }).click();
    await phone.page.getByText('Check your e-mail').waitFor();
    await phone.page.screenshot({ path: `${SHOTS}/forgot-password-sent-375.png`, fullPage: true });
    await expectNoSeriousViolations(phone.page);

    // The e-mail, as the SMTP fake received it, holds the one-time link.
    const mail = await mailFor(email, /new Gaugeline password/);
    const link = /https?:\/\/\S+(\/reset-password#token=[A-Za-z0-9_-]{43})/.exec(mail.text)?.[1];
    if (!link) throw new Error(`no reset link in: ${mail.text}`);
    await phone.page.goto(link);
    await phone.page.getByRole('heading', { name: 'Set a new password' }).waitFor();
    // The token leaves the address bar as soon as the page has read it.
    expect(new URL(phone.page.url()).hash).toBe('');
    await expectNoSeriousViolations(phone.page);

    await phone.page.getByLabel('New password', { exact: true }).fill('short');
    await phone.page.getByLabel('New password again').fill('different');
    await phone.page.getByRole('button', { name: 'Set new password' }).click();
    await phone.page.getByText('Password must be at least 12 characters.').waitFor();
    await phone.page.getByText('The two new passwords are not the same.').waitFor();
    await phone.page.screenshot({ path: `${SHOTS}/reset-password-errors-375.png`, fullPage: true });
    await expectNoSeriousViolations(phone.page);

    await phone.page.getByLabel('New password', { exact: true }).fill('my-own-new-password');
    await phone.page.getByLabel('New password again').fill('my-own-new-password');
    await phone.page.getByRole('button', { name: 'Set new password' }).click();
    await phone.page.getByText('Your new password is set.').waitFor();
    await phone.page.screenshot({ path: `${SHOTS}/reset-password-done-375.png`, fullPage: true });
    await expectNoSeriousViolations(phone.page);
    await phone.page.getByRole('link', { name: 'Sign in' }).click();

    // The old password no longer works; the new one does.
    await signIn(phone.page, email, 'first-password-from-owner');
    await phone.page.getByText('The e-mail or password is not right.').waitFor();
    await expectNoSeriousViolations(phone.page);
    await signIn(phone.page, email, 'my-own-new-password');
    await phone.page.getByTestId('user-name').filter({ hasText: name }).first().waitFor();
    await expectNoSeriousViolations(phone.page);

    // Then they change it again from their account page.
    await phone.page.goto('/account');
    await phone.page.getByLabel('Current password').fill('my-own-new-password');
    await phone.page.getByLabel('New password', { exact: true }).fill('changed-on-the-account-page');
    await phone.page.getByLabel('New password again').fill('changed-on-the-account-page');
    await phone.page.getByRole('button', { name: 'Change password' }).click();
    await phone.page.getByText('Your password is changed.').waitFor();
    await phone.page.screenshot({ path: `${SHOTS}/account-password-changed-375.png`, fullPage: true });
    await expectNoSeriousViolations(phone.page);
    await mailFor(email, /password was changed/);

    // The owner signs them out everywhere; their next page load lands on sign-in.
    await office.page.reload();
    const button = office.page.getByRole('button', { name: `Sign ${name} out everywhere` });
    await button.click();
    await office.page.getByText('Signed out of 1 device.').waitFor();
    await office.page.screenshot({ path: `${SHOTS}/users-signed-out-everywhere-375.png`, fullPage: true });
    await expectNoSeriousViolations(office.page);
    await phone.page.goto('/jobs');
    await phone.page.waitForURL((u) => u.pathname.startsWith('/sign-in'));

    // The owner's E-mail page lists what went out to the person, without the link.
    await office.page.goto('/mail');
    await office.page.getByRole('heading', { name: 'E-mail', exact: true }).waitFor();
    const recent = office.page.getByRole('list', { name: 'Recent e-mail' });
    await recent.getByText('Set a new Gaugeline password').first().waitFor();
    expect(await office.page.getByText('reset-password#token').count()).toBe(0);
    await office.page.screenshot({ path: `${SHOTS}/mail-375.png`, fullPage: true });
    await expectNoSeriousViolations(office.page);

    // Every page of the journey had the accessibility check (serious or critical WCAG 2 A/AA findings fail).
    for (const path of ['/users', '/sign-in', '/forgot-password', '/reset-password', '/account', '/mail', '/'])
      expect([...checkedPages], path).toContain(path);
    await office.context.close();
    await phone.context.close();
  });
});
