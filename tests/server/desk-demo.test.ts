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
      const curveTemps = [...data.desk.models.values()].flatMap((m) => m.coolingPoints.map((p) => p.outdoorF));
      expect(curveTemps.length).toBeGreaterThan(0);
      let ready = 0;
      let pending = 0;
      let options = 0;
      let readyOptions = 0;
      for (const job of jobs) {
        const desk = await s.agent.get(`/api/jobs/${job.id}/desk`);
        expect(desk.status).toBe(200);
        const isReady = desk.body.readiness.ready === true;
        if (isReady) ready += 1;
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
          if (isReady) {
            readyOptions += 1;
            // An option ready to propose must be sized as the trade would: every head against its zone's load
            // and every outdoor unit against its system's, within the sizing policy's range (default policy:
            // variable-speed heat pump 90–130 % of the total cooling load [MEM: ACCA Manual S 2nd ed. Table N2]).
            const coolingF = jobBody.designConditions.outdoorCoolingDryBulbF as number;
            const units = [
              ...direct.zones.map((z) => ({ name: z.name, key: z.indoorUnitKey, sizing: z.sizing })),
              ...direct.systems.map((y) => ({ name: y.name, key: y.outdoorUnitKey, sizing: y.sizing })),
            ];
            for (const u of units) {
              const what = `${acct.company} ${o.name} ${u.name} (${u.key})`;
              expect(u.sizing.withinRange, `${what}: ${u.sizing.warnings.join(' | ')}`).toBe(true);
              // The demo cooling curves span 75–115 °F: a design temperature inside them is the maker's data.
              if (coolingF >= Math.min(...curveTemps) && coolingF <= Math.max(...curveTemps))
                expect(
                  u.sizing.warnings.filter((w) => w.includes("outside the maker's cooling data")),
                  what,
                ).toEqual([]);
            }
          }
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
      expect(readyOptions).toBeGreaterThanOrEqual(3);
      expect(pending).toBeGreaterThanOrEqual(1);
    },
  );
});
