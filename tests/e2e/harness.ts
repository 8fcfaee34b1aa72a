import { randomUUID } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { loadConfig } from '../../server/src/config';
import { startPaymentsFake, type PaymentsFake } from '../../server/src/fakes/payments-fake';
import { startSmtpFake, type SmtpFake } from '../../server/src/fakes/smtp-fake';
import { LOCAL_WEBHOOK_SECRET } from '../../server/src/config';
import { startServer, type Running } from '../../server/src/server';
import { ensureLocalSealCertificate, LOCAL_SEAL_PASSPHRASE } from '../../server/src/services/seal-certificate';
import { testDatabaseUrl } from '../helpers/test-app';

export const PHONE = { width: 375, height: 812 } as const;
export const DESKTOP = { width: 1440, height: 900 } as const;
export const SHOTS = 'tests/e2e/screenshots';

export interface E2E {
  url: string;
  browser: Browser;
  smtp: SmtpFake;
  /** The payments fake the server's SDK talks to; its signed webhooks go to the server's hook URL. */
  payments: PaymentsFake;
  running: Running;
  /**
   * A fresh profile. Service workers are blocked unless asked for: the built client installs one,
   * and a cached shell would hide what a journey means to test (only the offline test wants it).
   */
  newPage(
    viewport: { width: number; height: number },
    options?: { serviceWorkers?: 'allow' | 'block' },
  ): Promise<{ context: BrowserContext; page: Page }>;
  close(): Promise<void>;
}

/** The real server (built client, seeded test database, SMTP fake) and Debian's Chromium, headless; each context is a fresh profile. */
export async function startE2E(): Promise<E2E> {
  const smtp = await startSmtpFake({ port: 0 });
  const payments = await startPaymentsFake({ port: 0, webhookSecret: LOCAL_WEBHOOK_SECRET });
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: testDatabaseUrl(),
    STORAGE_DIR: process.env.STORAGE_DIR,
    PORT: '0',
    SMTP_PORT: String(smtp.port),
    PAYMENTS_FAKE_PORT: String(payments.port),
    LOG_LEVEL: 'silent',
    DEV_OUTBOX: 'on',
    LOGIN_MAX_PER_IP: '10000',
    SEAL_P12_FILE: await ensureLocalSealCertificate(),
    SEAL_P12_PASSPHRASE: LOCAL_SEAL_PASSPHRASE,
    // Its own task names: another e2e file's server never sends this one's e-mail.
    QUEUE_NAMESPACE: `e2e-${randomUUID().slice(0, 8)}`,
  });
  const running = await startServer(config, { outbox: smtp });
  payments.setWebhookTarget(`${running.url}/api/hooks/payments`);
  mkdirSync(SHOTS, { recursive: true });
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  return {
    url: running.url,
    browser,
    smtp,
    payments,
    running,
    async newPage(viewport, options = {}) {
      const context = await browser.newContext({
        viewport,
        baseURL: running.url,
        serviceWorkers: options.serviceWorkers ?? 'block',
      });
      const page = await context.newPage();
      page.setDefaultTimeout(15_000);
      // Any request to another host would be a bug (fonts and assets ship with the app).
      await page.route(/^(?!http:\/\/127\.0\.0\.1)/, (route) => route.abort());
      return { context, page };
    },
    async close() {
      await browser.close();
      await running.close();
      await smtp.close();
      await payments.close();
    },
  };
}

export async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}
