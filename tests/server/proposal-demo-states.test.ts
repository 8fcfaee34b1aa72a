import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEFAULT_LOSS_REASONS, CANCELLED_BY_BUYER } from '@contract';
import {
  DEMO_LOST_REASON,
  DEMO_PROPOSAL_STATES,
  DEMO_STATE_STATUS,
  type DemoProposalState,
} from '../../fixtures/demo-proposal-states';
import { demoAccounts } from '../../fixtures/seed';
import { createLocalDiskStorage } from '../../server/src/services/storage';
import { login, type Session } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';

/**
 * The demo proposals in every state (fixtures/demo-proposal-states.ts), made at seeding by the product's own
 * services: `npm test` seeds the demo into the test database first. Each state's job has the status its proposal
 * gave it, the audit trail the real steps write in order, and the rows behind it (link, e-mail, signature and its
 * sealed copy, payment, cancellation).
 */
let t: TestApp;
beforeAll(async () => {
  t = await buildTestApp();
});
afterAll(async () => t.close());

/** The trail each state's steps write, in `seq` order (the demo's own; other tests never touch these jobs). */
const TRAIL: Record<DemoProposalState, string[]> = {
  sent: ['issued', 'pdf-ready', 'sent'],
  viewed: ['issued', 'pdf-ready', 'sent', 'opened', 'viewed'],
  lost: ['issued', 'pdf-ready', 'sent', 'opened', 'viewed', 'marked-lost'],
  signed: ['issued', 'pdf-ready', 'sent', 'opened', 'viewed', 'option-chosen', 'consented', 'signed'],
  paid: ['issued', 'pdf-ready', 'sent', 'opened', 'viewed', 'option-chosen', 'consented', 'signed', 'paid'],
  cancelled: [
    'issued',
    'pdf-ready',
    'sent',
    'opened',
    'viewed',
    'option-chosen',
    'consented',
    'signed',
    'paid',
    'cancelled',
    'refunded',
  ],
};

interface JobItem {
  id: string;
  status: string;
  lostReason: string | null;
  customer: { name: string };
}
interface EventItem {
  seq: number;
  kind: string;
  at: string;
  by: { kind: string };
  data: Record<string, unknown>;
}

const sessions = new Map<string, Session>();
async function estimatorOf(company: string): Promise<Session> {
  const found = sessions.get(company);
  if (found) return found;
  const acct = demoAccounts.find((d) => d.role === 'estimator' && d.company === company);
  if (!acct) throw new Error(`no demo estimator of ${company}`);
  const s = await login(t.app, acct.email, acct.password);
  sessions.set(company, s);
  return s;
}

/** The demo job of this customer, found as the jobs list's search finds it (the sales history fills the list). */
async function jobOf(s: Session, customerName: string): Promise<JobItem> {
  const r = await s.agent.get(`/api/jobs?search=${encodeURIComponent(customerName)}`);
  const job = (r.body.items as JobItem[]).find((j) => j.customer.name === customerName);
  if (!job) throw new Error(`no demo job for ${customerName}`);
  return job;
}

const sql = <T>(query: string, params: unknown[]) => t.orm.em.fork().getConnection().execute<T[]>(query, params);
const sha = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

describe('demo proposals in every state', () => {
  it('covers every state: sent, viewed, signed, paid, cancelled and lost, in both demo companies', () => {
    expect(new Set(DEMO_PROPOSAL_STATES.map((s) => s.state))).toEqual(
      new Set(['sent', 'viewed', 'signed', 'paid', 'cancelled', 'lost']),
    );
    expect(new Set(DEMO_PROPOSAL_STATES.map((s) => s.company))).toEqual(new Set(demoAccounts.map((a) => a.company)));
  });

  it.each(DEMO_PROPOSAL_STATES.map((s) => ({ ...s, name: s.customer.name })))(
    '$state: $name ($company) — the job’s status, the trail in order, and the rows behind it',
    async (spec) => {
      const s = await estimatorOf(spec.company);
      const job = await jobOf(s, spec.customer.name);
      expect(job.status).toBe(DEMO_STATE_STATUS[spec.state]);
      expect(job.lostReason).toBe(
        spec.state === 'cancelled' ? CANCELLED_BY_BUYER : spec.state === 'lost' ? DEMO_LOST_REASON : null,
      );

      const r = await s.agent.get(`/api/jobs/${job.id}/proposal`);
      expect(r.status).toBe(200);
      const proposal = r.body.proposal as {
        id: string;
        versions: {
          number: number;
          current: boolean;
          pdf: { state: string; sha256: string | null };
          signed: { at: string; signerName: string; copySha256: string | null } | null;
        }[];
        events: EventItem[];
      };
      expect(proposal.versions.map((v) => [v.number, v.current, v.pdf.state])).toEqual([[1, true, 'ready']]);
      const events = proposal.events;
      expect(events.map((e) => e.kind)).toEqual(TRAIL[spec.state]);
      // In seq order, the times never go back: each step ran with the clock at its own moment.
      for (const [i, e] of events.entries())
        if (i > 0) expect(Date.parse(e.at), e.kind).toBeGreaterThanOrEqual(Date.parse(events[i - 1]?.at ?? ''));
      // The customer's own steps are the customer's, with the address and browser the trail keeps.
      for (const e of events.filter((x) =>
        ['opened', 'viewed', 'option-chosen', 'consented', 'signed'].includes(x.kind),
      ))
        expect(e.by.kind, e.kind).toBe('customer');

      // The link: sent to the customer's e-mail, its token's hash stored, live (not revoked, not expired);
      // its e-mail went out through the queue.
      const links = await sql<{ recipient: string; token: string | null; live: boolean; mail: string }>(
        `select l.recipient, l.token_sha256 as token, (l.revoked_at is null and l.expires_at > now()) as live,
                m.state as mail
           from proposal_link l join outgoing_message m on m.id = l.message_id where l.proposal_id = ?`,
        [proposal.id],
      );
      expect(links).toHaveLength(1);
      expect(links[0]).toMatchObject({ recipient: spec.customer.email, live: true, mail: 'sent' });
      expect(links[0]?.token).toMatch(/^[0-9a-f]{64}$/);

      const signatures = await sql<{
        signer_name: string;
        document_sha256: string;
        option_position: number;
        copy_key: string | null;
        copy_sha256: string | null;
      }>(
        `select s.signer_name, s.document_sha256, s.option_position, p.storage_key as copy_key, p.sha256 as copy_sha256
           from proposal_signature s left join proposal_signed_pdf p on p.signature_id = s.id where s.proposal_id = ?`,
        [proposal.id],
      );
      const payments = await sql<{ state: string; amount_cents: number; refund_id: string | null }>(
        'select state, amount_cents, refund_id from payment where proposal_id = ?',
        [proposal.id],
      );
      const cancellations = await sql<{ method: string; by_customer: boolean; reason: string | null }>(
        'select method, by_customer, reason from proposal_cancellation where proposal_id = ?',
        [proposal.id],
      );
      const signedStates: DemoProposalState[] = ['signed', 'paid', 'cancelled'];
      if (!signedStates.includes(spec.state)) {
        expect(signatures).toEqual([]);
        expect(payments).toEqual([]);
        expect(cancellations).toEqual([]);
        expect(proposal.versions[0]?.signed).toBeNull();
      } else {
        // Signed on the version's own PDF, and the sealed copy made: stored under the hash recorded.
        expect(signatures).toHaveLength(1);
        const sig = signatures[0];
        expect(sig).toMatchObject({ signer_name: spec.customer.name, option_position: spec.chooses });
        expect(sig?.document_sha256.trim()).toBe(proposal.versions[0]?.pdf.sha256);
        expect(proposal.versions[0]?.signed).toMatchObject({ signerName: spec.customer.name });
        expect(proposal.versions[0]?.signed?.copySha256).toBe(sig?.copy_sha256?.trim());
        const storage = createLocalDiskStorage(process.env.STORAGE_DIR ?? '.data/uploads');
        const copy = sig?.copy_key ? await storage.get(sig.copy_key) : null;
        expect(copy?.subarray(0, 5).toString()).toBe('%PDF-');
        expect(sha(copy ?? Buffer.alloc(0))).toBe(sig?.copy_sha256?.trim());
        const signedEvent = events.find((e) => e.kind === 'signed');
        expect(signedEvent?.data.documentSha256).toBe(proposal.versions[0]?.pdf.sha256);
      }
      if (spec.state === 'signed') {
        // The option chosen asks no deposit, so the signature alone won the job; nothing was paid.
        expect(events.find((e) => e.kind === 'option-chosen')?.data.position).toBe(spec.chooses);
        expect(payments).toEqual([]);
      }
      if (spec.state === 'paid' || spec.state === 'cancelled') {
        expect(payments).toHaveLength(1);
        const paid = events.find((e) => e.kind === 'paid');
        expect(paid?.by.kind).toBe('system');
        expect(paid?.data.amountCents).toBe(payments[0]?.amount_cents);
        expect(payments[0]?.amount_cents).toBeGreaterThan(0);
      }
      if (spec.state === 'paid') {
        expect(payments[0]).toMatchObject({ state: 'succeeded', refund_id: null });
        expect(cancellations).toEqual([]);
      }
      if (spec.state === 'cancelled') {
        // Cancelled on the page by the buyer, inside the window; the deposit refunded through the payment service.
        expect(payments[0]?.state).toBe('refunded');
        expect(payments[0]?.refund_id).toMatch(/^re_/);
        expect(cancellations).toEqual([{ method: 'page', by_customer: true, reason: expect.any(String) }]);
        const cancelled = events.find((e) => e.kind === 'cancelled');
        expect(cancelled?.data).toMatchObject({ method: 'page', refund: true });
        const signedAt = Date.parse(events.find((e) => e.kind === 'signed')?.at ?? '');
        expect(String(cancelled?.data.lastDayToCancel) >= new Date(signedAt).toISOString().slice(0, 10)).toBe(true);
      }
      if (spec.state === 'lost') {
        const marked = events.find((e) => e.kind === 'marked-lost');
        expect(marked?.by.kind).toBe('staff');
        expect(marked?.data).toMatchObject({ reason: DEMO_LOST_REASON, from: 'proposed' });
        expect(DEFAULT_LOSS_REASONS).toContain(DEMO_LOST_REASON);
      }
    },
  );

  it('every demo company’s proposals carry its business address, contact and logo (the cancellation notice needs the address)', async () => {
    for (const company of new Set(DEMO_PROPOSAL_STATES.map((x) => x.company))) {
      const s = await estimatorOf(company);
      const spec = DEMO_PROPOSAL_STATES.find((x) => x.company === company);
      const job = await jobOf(s, spec?.customer.name ?? '');
      const v = await s.agent.get(`/api/jobs/${job?.id}/proposal/versions/1`);
      const c = v.body.snapshot.company as Record<string, string | null>;
      expect(c.name).toBe(company);
      for (const k of ['address', 'phone', 'email', 'licence', 'logoKey']) expect(c[k], `${company} ${k}`).toBeTruthy();
      expect(String(c.terms).length).toBeGreaterThan(50);
      expect(String(c.warranty).length).toBeGreaterThan(50);
    }
  });
});
