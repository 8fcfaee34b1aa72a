import { computeDesign, monthlyPaymentCents, pricingSchema } from '@calc';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts } from '../../fixtures/seed';
import { login } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { loadCompanyDesk } from '../../server/src/modules/desk/desk-inputs';
import { engineData } from '../../server/src/modules/desk/desk-compute';

let t: TestApp;
beforeAll(async () => {
  t = await buildTestApp();
});
afterAll(async () => t.close());

interface Option {
  id: string;
  name: string;
  design: Parameters<typeof computeDesign>[0]['design'];
  pricing: {
    sellRule: { method: 'markup' | 'margin'; percent: number } | null;
    discounts: { label: string; kind: 'percent' | 'amount'; value: number }[];
    tax: null;
    deposit: { kind: 'percent' | 'amount'; value: number };
    financingPlanKey: string | null;
  };
  discountRequest: { state: string } | null;
  problems: unknown[];
  result: { price: Record<string, number>; monthly: { planKey: string; monthlyPaymentCents: number }[] };
}

// `npm test` seeds the demo scenario into the test database before the suite (scripts/test.ts).
describe('demo desk', () => {
  it.each(demoAccounts.filter((d) => d.role === 'estimator'))(
    '$company: jobs in design carry priced options, one is ready to propose, and the server’s totals are calc’s',
    async (acct) => {
      const s = await login(t.app, acct.email, acct.password);
      const me = await s.agent.get('/api/auth/me');
      const data = engineData(await loadCompanyDesk(t.orm.em.fork(), me.body.company.id));
      const jobs = (await s.agent.get('/api/jobs?status=design')).body.items as { id: string }[];
      let ready = 0;
      let pending = 0;
      let options = 0;
      for (const job of jobs) {
        const desk = await s.agent.get(`/api/jobs/${job.id}/desk`);
        expect(desk.status).toBe(200);
        if (desk.body.readiness.ready) ready += 1;
        const jobBody = (await s.agent.get(`/api/jobs/${job.id}`)).body.job;
        const rooms = (await s.agent.get(`/api/jobs/${job.id}/rooms`)).body.rooms.map(
          (r: { input: unknown }) => r.input,
        );
        for (const o of desk.body.options as Option[]) {
          options += 1;
          expect(o.problems, o.name).toEqual([]);
          if (o.discountRequest?.state === 'pending') pending += 1;
          const rule = o.pricing.sellRule ?? data.desk.settings.defaultSellRule;
          const plan = data.desk.financing.find((f) => f.key === o.pricing.financingPlanKey);
          const pricing = pricingSchema.parse({
            method: rule.method,
            percent: rule.percent,
            discounts: o.pricing.discounts,
            taxRatePercent: data.desk.settings.taxRatePercent,
            taxOn: data.desk.settings.taxAppliesTo,
            deposit: o.pricing.deposit,
            financing: plan ? { aprPercent: plan.aprPercent, months: plan.months } : undefined,
          });
          const direct = computeDesign({
            home: {
              id: job.id,
              designConditions: jobBody.designConditions,
              tightness: jobBody.tightness,
              ...jobBody.house,
              rooms,
            },
            design: o.design,
            catalog: data.catalog,
            priceBook: data.priceBook,
            pricing,
          });
          // Issue 13: the demo price book prices every takeoff item of the demo options (materials name their item).
          expect(
            direct.warnings.filter((w) => w.startsWith('No price for')),
            o.name,
          ).toEqual([]);
          for (const k of [
            'costCents',
            'sellCents',
            'discountCents',
            'taxCents',
            'totalCents',
            'depositCents',
            'balanceCents',
          ] as const)
            expect(o.result.price[k], `${o.name} ${k}`).toBe(direct.price[k]);
          expect(o.result.price.monthlyPaymentCents).toBe(direct.price.monthlyPaymentCents);
          for (const m of o.result.monthly) {
            const f = data.desk.financing.find((x) => x.key === m.planKey);
            expect(f).toBeDefined();
            // The standard annuity payment on the balance [PUB: annuity formula; calc checks it against mathjs].
            expect(m.monthlyPaymentCents).toBe(
              monthlyPaymentCents({
                principalCents: direct.price.balanceCents,
                aprPercent: f?.aprPercent ?? 0,
                months: f?.months ?? 1,
              }),
            );
          }
        }
      }
      expect(options).toBeGreaterThanOrEqual(5);
      expect(ready).toBeGreaterThanOrEqual(1);
      expect(pending).toBeGreaterThanOrEqual(1);
    },
  );
});
