import { chromium } from 'playwright-core';
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox'] });
const base = 'http://127.0.0.1:5391/';
const JOB = '11111111-1111-4111-8111-111111111111';
const shots = [
  ['walk-375', `?path=/jobs/${JOB}`, 375],
  ['walk-1440', `?path=/jobs/${JOB}`, 1440],
  ['loads-375', `?path=/jobs/${JOB}/loads`, 375],
  ['loads-1440', `?path=/jobs/${JOB}/loads`, 1440],
  ['list-375', `?path=/jobs`, 375],
  ['new-375', `?path=/jobs/new`, 375],
];
for (const [name, q, w] of shots) {
  const page = await browser.newPage({ viewport: { width: w, height: 900 } });
  const errors = [];
  page.on('pageerror', (e) => errors.push(String(e)));
  page.on('console', (m) => { if (m.type() === 'error') errors.push(m.text()); });
  await page.goto(base + q);
  await page.waitForTimeout(2500);
  await page.screenshot({ path: `/tmp/gl-${name}.png`, fullPage: true });
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  console.log(name, 'overflow', overflow, errors.slice(0, 3));
  await page.close();
}
for (const rooms of [4, 12]) {
  for (const format of ['A4', 'Letter']) {
    const page = await browser.newPage();
    await page.goto(base + `?rooms=${rooms}&path=/jobs/${JOB}/loads/print`);
    await page.waitForTimeout(2000);
    await page.emulateMedia({ media: 'print' });
    const pdf = await page.pdf({ format, preferCSSPageSize: false });
    const pages = (pdf.toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? []).length;
    console.log('print', rooms, format, 'pages', pages);
    if (rooms === 12 && format === 'Letter') await page.screenshot({ path: '/tmp/gl-print.png', fullPage: true });
    await page.close();
  }
}
await browser.close();
