import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { proposalSnapshot } from '@contract';
import { CompanyLogoSchema } from '../../server/src/modules/company-settings/proposal-details.entity';
import { login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { deskJob, newOption, seedData, singleZone } from './desk-helpers';
import { expectProblem, post } from './jobs-helpers';

/**
 * Issue 14, company settings for proposals: the owner's contact lines, licence, terms, warranty and extra
 * cancellation wording (validated, version-locked, bad input changes nothing), the logo (checked like room
 * photos, re-encoded to PNG, stored through services/storage), and issuing copies them into the frozen
 * snapshot so a later change does not alter an issued version.
 */
let t: TestApp;
let a: TestCompany;
let owner: Session;
let estimator: Session;
let otherOwner: Session;
const MAX = 256 * 1024;
const PATH = '/api/company/proposal-details';

const DETAILS = {
  address: '77 Quillfeather Way\r\nUnit 3\nMossgrove, OR 97000',
  phone: '(555) 010-7788',
  email: 'Office@Quillfeather-Air.example',
  licence: 'Contractor licence QA-000123 (demo)',
  terms: 'Prices hold for 30 days.\n\nThe balance is due on completion.',
  warranty: 'Labor: two years from start-up.',
  cancellationExtra: 'Invented state wording: the buyer may also cancel by e-mail to the address above.',
};

beforeAll(async () => {
  t = await buildTestApp({ UPLOAD_MAX_BYTES: MAX });
  a = await makeCompany(t.orm.em.fork(), 'Details', { businessAddress: false });
  await seedData(t.orm.em.fork(), a.id);
  const b = await makeCompany(t.orm.em.fork(), 'DetailsB', { businessAddress: false });
  owner = await login(t.app, a.users.owner.email);
  estimator = await login(t.app, a.users.estimator.email);
  otherOwner = await login(t.app, b.users.owner.email);
});
afterAll(async () => t.close());

const put = (s: Session, version: number, body: unknown) =>
  s.agent
    .put(PATH)
    .set('X-CSRF-Token', s.csrf)
    .set('If-Match', `"${version}"`)
    .send(body as object);
const read = async (s: Session) => {
  const r = await s.agent.get(PATH);
  expect(r.status).toBe(200);
  return r.body.details;
};
const uploadLogo = (s: Session, bytes: Buffer, filename = 'logo.png', contentType = 'image/png') =>
  post(s, `${PATH}/logo`).attach('file', bytes, { filename, contentType });
/** A logo with a transparent background, as a designer would send it. */
const transparentLogo = (width = 320, height = 120) =>
  sharp({ create: { width, height, channels: 4, background: { r: 0, g: 0, b: 0, alpha: 0 } } })
    .composite([
      {
        input: { create: { width: width / 2, height: height / 2, channels: 4, background: '#1d6b5f' } },
        top: height / 4,
        left: width / 4,
      },
    ])
    .png()
    .toBuffer();

/** Issues a proposal version of a fresh ready job and returns its frozen snapshot. */
async function issuedSnapshot() {
  const { job, rooms } = await deskJob(estimator);
  await newOption(estimator, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '', 30) });
  const ready = await post(estimator, `/api/jobs/${job.id}/ready`).send({
    sizingOverride: { reason: 'The owner keeps this room cool for a home studio; the larger unit is wanted.' },
  });
  expect(ready.status, JSON.stringify(ready.body)).toBe(200);
  const issued = await post(estimator, `/api/jobs/${job.id}/proposal/versions`).send();
  expect(issued.status, JSON.stringify(issued.body)).toBe(201);
  const v = await estimator.agent.get(`/api/jobs/${job.id}/proposal/versions/1`);
  return { jobId: job.id, snapshot: proposalSnapshot.parse(v.body.snapshot), raw: JSON.stringify(v.body.snapshot) };
}

describe('proposal details: saving and validating', () => {
  it('starts empty at version 0; the owner saves them (trimmed, line ends made \\n, e-mail lower case)', async () => {
    const empty = await read(estimator);
    expect(empty).toMatchObject({ address: '', terms: '', logo: null, version: 0, updatedAt: null });
    const r = await put(owner, 0, DETAILS);
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(r.headers.etag).toBe('"1"');
    expect(r.body.details).toMatchObject({
      ...DETAILS,
      address: '77 Quillfeather Way\nUnit 3\nMossgrove, OR 97000',
      email: 'office@quillfeather-air.example',
      version: 1,
    });
    expect(await read(estimator)).toEqual(r.body.details);
  });

  it('is the owner’s: an estimator gets 403 and nothing changes', async () => {
    const before = await read(owner);
    expectProblem(await put(estimator, before.version, { ...DETAILS, terms: 'Estimator terms' }), 403);
    expect(await read(owner)).toEqual(before);
  });

  it('refuses bad input with a clear message per field and changes nothing', async () => {
    const before = await read(owner);
    const cases: [Record<string, unknown>, string, RegExp][] = [
      [{ phone: '12' }, 'phone', /phone number using digits/],
      [{ email: 'not-an-address' }, 'email', /valid e-mail address/],
      [{ address: 'a\nb\nc\nd\ne' }, 'address', /at most 4 lines/],
      [{ address: 'x'.repeat(401) }, 'address', /at most 400 characters/],
      [{ licence: 'Licence\nsecond line' }, 'licence', /one line of plain text/],
      [{ terms: 'x'.repeat(20001) }, 'terms', /at most 20,000 characters/],
      [{ warranty: 'bell \u0007 here' }, 'warranty', /control character/],
      [{ cancellationExtra: 42 }, 'cancellationExtra', /must be text/],
    ];
    for (const [change, field, message] of cases) {
      const r = await put(owner, before.version, { ...DETAILS, ...change });
      expectProblem(r, 400);
      const issue = (r.body.errors as { path: string; message: string }[]).find((e) => e.path.includes(field));
      expect(issue?.message, `${field}: ${JSON.stringify(r.body.errors)}`).toMatch(message);
    }
    expectProblem(await put(owner, before.version, { ...DETAILS, logoKey: 'x' }), 400);
    expectProblem(await put(owner, before.version, { address: 'only one field' }), 400);
    expect(await read(owner)).toEqual(before);
  });

  it('a stale version is a 409 with the values now; another company sees only its own', async () => {
    const before = await read(owner);
    const stale = await put(owner, before.version - 1, { ...DETAILS, terms: 'Stale' });
    expectProblem(stale, 409);
    expect(stale.body.currentVersion).toBe(before.version);
    expect(stale.body.current.terms).toBe(before.terms);
    expectProblem(await put(owner, before.version + 5, DETAILS), 409);
    const theirs = await read(otherOwner);
    expect(theirs).toMatchObject({ address: '', version: 0 });
    expect(await read(owner)).toEqual(before);
  });
});

describe('proposal details: the logo', () => {
  it('is checked by content, re-encoded to PNG with its transparency, stored, and served to the office', async () => {
    const r = await uploadLogo(owner, await transparentLogo(), 'brand.jpg', 'image/jpeg');
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    const logo = r.body.details.logo;
    expect(logo).toMatchObject({ width: 320, height: 120 });
    const got = await estimator.agent.get(logo.url).buffer(true);
    expect(got.status).toBe(200);
    expect(got.headers['content-type']).toBe('image/png');
    expect(got.headers['x-content-type-options']).toBe('nosniff');
    const meta = await sharp(got.body as Buffer).metadata();
    expect(meta).toMatchObject({ format: 'png', width: 320, height: 120, hasAlpha: true });
    expect(meta.exif).toBeUndefined();
    // Another company cannot read it.
    expectProblem(await otherOwner.agent.get(logo.url), 404);
  });

  it('a large logo is scaled to 1200 px on its long edge', async () => {
    const big = await sharp({ create: { width: 2400, height: 600, channels: 3, background: '#224466' } })
      .jpeg()
      .toBuffer();
    const r = await uploadLogo(owner, big, 'wide.jpg', 'image/jpeg');
    expect(r.status).toBe(200);
    expect(r.body.details.logo).toMatchObject({ width: 1200, height: 300 });
  });

  it('refuses what is not an image, too many bytes, a non-owner and a missing file; the logo stays as it was', async () => {
    const before = await read(owner);
    const notImage = await uploadLogo(
      owner,
      Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"/>'.repeat(4)),
      'logo.png',
    );
    expectProblem(notImage, 415);
    expect(notImage.body.detail).toBe(
      'This file is not a JPEG, PNG or WebP logo (its content was checked, not its name). Upload a logo in one of those formats.',
    );
    const noisy = await sharp(Buffer.from(Array.from({ length: 600 * 600 * 3 }, (_, i) => (i * 7919) % 251)), {
      raw: { width: 600, height: 600, channels: 3 },
    })
      .png({ compressionLevel: 0 })
      .toBuffer();
    expect(noisy.length).toBeGreaterThan(MAX);
    const big = await uploadLogo(owner, noisy);
    expectProblem(big, 413);
    expect(big.body.detail).toBe('The logo is larger than 0.3 MB.');
    expectProblem(await uploadLogo(estimator, await transparentLogo()), 403);
    expectProblem(await post(owner, `${PATH}/logo`).field('note', 'x'), 400);
    expect(await read(owner)).toEqual(before);
  });
});

describe('issuing freezes the company part', () => {
  it('the snapshot carries the settings and the logo key; a later change leaves the issued version as it was', async () => {
    const details = await read(owner);
    const first = await issuedSnapshot();
    const logoRow = await t.orm.em.fork().findOneOrFail(CompanyLogoSchema, { company: a.id });
    expect(first.snapshot.company).toEqual({
      name: a.name,
      address: details.address,
      phone: details.phone,
      email: details.email,
      licence: details.licence,
      logoKey: logoRow.storageKey,
      terms: details.terms,
      warranty: details.warranty,
      cancellationExtra: details.cancellationExtra,
    });

    // The owner changes every text and replaces the logo, then removes it.
    const changed = await put(owner, details.version, {
      address: '1 New Street, Mossgrove',
      phone: '',
      email: '',
      licence: '',
      terms: 'New terms',
      warranty: 'New warranty',
      cancellationExtra: '',
    });
    expect(changed.status).toBe(200);
    expect((await uploadLogo(owner, await transparentLogo(200, 80))).status).toBe(200);
    const v = await estimator.agent.get(`/api/jobs/${first.jobId}/proposal/versions/1`);
    expect(JSON.stringify(v.body.snapshot)).toBe(first.raw);
    // The replaced logo's file stays: version 1 still prints it.
    expect(await t.services.storage.get(logoRow.storageKey)).not.toBeNull();

    const second = await issuedSnapshot();
    expect(second.snapshot.company).toMatchObject({
      address: '1 New Street, Mossgrove',
      phone: null,
      email: null,
      licence: null,
      terms: 'New terms',
      cancellationExtra: '',
    });
    expect(second.snapshot.company.logoKey).not.toBe(logoRow.storageKey);

    const del = await owner.agent.delete(`${PATH}/logo`).set('X-CSRF-Token', owner.csrf);
    expect(del.status).toBe(204);
    expect((await read(owner)).logo).toBeNull();
    expect(await t.services.storage.get(second.snapshot.company.logoKey ?? '')).not.toBeNull();
    expectProblem(await owner.agent.delete(`${PATH}/logo`).set('X-CSRF-Token', owner.csrf), 404);
    const third = await issuedSnapshot();
    expect(third.snapshot.company.logoKey).toBeNull();
  });

  it('a logo no version printed is removed from storage when it is replaced', async () => {
    expect((await uploadLogo(owner, await transparentLogo(100, 40))).status).toBe(200);
    const row = await t.orm.em.fork().findOneOrFail(CompanyLogoSchema, { company: a.id });
    expect(await t.services.storage.get(row.storageKey)).not.toBeNull();
    expect((await uploadLogo(owner, await transparentLogo(120, 40))).status).toBe(200);
    expect(await t.services.storage.get(row.storageKey)).toBeNull();
  });
});

describe('issuing needs the business address (the cancellation notice names the seller’s address: 16 CFR 429.1)', () => {
  it('without one: 409 problem+json saying to add it in Settings, nothing written; with one: issued', async () => {
    const c = await makeCompany(t.orm.em.fork(), 'NoAddress', { businessAddress: false });
    await seedData(t.orm.em.fork(), c.id);
    const cOwner = await login(t.app, c.users.owner.email);
    const cEstimator = await login(t.app, c.users.estimator.email);
    const { job, rooms } = await deskJob(cEstimator);
    await newOption(cEstimator, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '', 30) });
    const ready = await post(cEstimator, `/api/jobs/${job.id}/ready`).send({
      sizingOverride: { reason: 'The owner keeps this room cool for a home studio; the larger unit is wanted.' },
    });
    expect(ready.status, JSON.stringify(ready.body)).toBe(200);

    // The screen is told before anyone tries: the reason and where it is put right. The estimator cannot open
    // Settings, so the words send them to the owner; the owner is told to add it.
    const screen = await cEstimator.agent.get(`/api/jobs/${job.id}/proposal`);
    expect(screen.body.canIssue).toEqual({
      ok: false,
      fix: 'settings',
      reason: expect.stringMatching(/^Ask the owner to add the business address in Settings .*16 CFR 429\.1/),
    });
    const ownerScreen = await cOwner.agent.get(`/api/jobs/${job.id}/proposal`);
    expect(ownerScreen.body.canIssue.reason).toMatch(/^Add the business address in Settings/);

    const refused = await post(cEstimator, `/api/jobs/${job.id}/proposal/versions`).send();
    expectProblem(refused, 409);
    expect(refused.body.detail).toMatch(/business address in Settings/);
    expect(refused.body.fix).toBe('settings');
    // Nothing changed: no proposal, no version, no event, no PDF job; the job is still ready and in design.
    const rows = await t.orm.em
      .fork()
      .getConnection()
      .execute<{ proposals: string; versions: string; events: string }[]>(
        `select (select count(*) from proposal where job_id = ?) as proposals,
                (select count(*) from proposal_version where company_id = ?) as versions,
                (select count(*) from proposal_event where company_id = ?) as events`,
        [job.id, c.id, c.id],
      );
    expect(rows[0]).toEqual({ proposals: '0', versions: '0', events: '0' });
    const after = (await cEstimator.agent.get(`/api/jobs/${job.id}`)).body.job;
    expect(after).toMatchObject({ status: 'design', hasProposal: false });
    expect(after.readyToProposeAt).not.toBeNull();

    // A blank address is no address.
    expect((await put(cOwner, 0, { ...DETAILS, address: '   ' })).status).toBe(200);
    expectProblem(await post(cEstimator, `/api/jobs/${job.id}/proposal/versions`).send(), 409);

    const saved = await read(cOwner);
    expect((await put(cOwner, saved.version, DETAILS)).status).toBe(200);
    expect((await cEstimator.agent.get(`/api/jobs/${job.id}/proposal`)).body.canIssue).toEqual({ ok: true });
    const issued = await post(cEstimator, `/api/jobs/${job.id}/proposal/versions`).send();
    expect(issued.status, JSON.stringify(issued.body)).toBe(201);
    const v = await cEstimator.agent.get(`/api/jobs/${job.id}/proposal/versions/1`);
    expect(v.body.snapshot.company.address).toBe('77 Quillfeather Way\nUnit 3\nMossgrove, OR 97000');
  });
});
