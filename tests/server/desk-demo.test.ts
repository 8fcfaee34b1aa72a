import { computeDesign, isDuctedUnit, monthlyPaymentCents, pricingSchema, TAKEOFF_DEFAULTS } from '@calc';
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
      // The demo catalog sells no R-410A outdoor unit (reference §11 row 11.6: not allowed in a new split system in 2026).
      expect(data.catalog.outdoorUnits.filter((u) => u.refrigerant === 'R-410A').map((u) => u.key)).toEqual([]);
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
            // Issue 13: an option without its own rule sells each line at its price-book rule.
            sellRulesBy: o.pricing.sellRule ? 'option' : 'line',
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
          // …and stays priced as the estimator lengthens a line: each kit length the takeoff picks for a circuit, up
          // to the outdoor unit's longest allowed line, is in the price book (the desk journey's 60 ft run on a
          // 1/4 × 1/2 circuit once showed "no price" for the 75 ft kit).
          for (const [si, y] of o.design.systems.entries()) {
            const maxFt = data.catalog.outdoorUnits.find((u) => u.key === y.outdoorUnitKey)?.maxLineLengthFt ?? 0;
            for (const [ci, c] of y.circuits.entries())
              for (const lengthFt of TAKEOFF_DEFAULTS.lineSetKitLengthsFt.filter((l) => l <= maxFt)) {
                const longer = structuredClone(o.design);
                const circuit = longer.systems[si]?.circuits[ci];
                if (circuit) circuit.lengthFt = lengthFt;
                const r = computeDesign({
                  home: {
                    id: job.id,
                    designConditions: jobBody.designConditions,
                    tightness: jobBody.tightness,
                    ...jobBody.house,
                    rooms,
                  },
                  design: longer,
                  catalog: data.catalog,
                  priceBook: data.priceBook,
                  pricing,
                });
                expect(
                  r.warnings.filter((w) => w.startsWith('No price for')),
                  `${o.name} ${y.name} circuit to ${c.zoneKey} at ${lengthFt} ft`,
                ).toEqual([]);
              }
          }
          // Issue 13: no demo system is R-410A (GWP 2088, above the 700 limit of the Technology Transitions rule for
          // new split systems from 2025 [PUB: reference §11, row 11.6]), so calc's rule warning never shows on the demo.
          for (const y of direct.systems) {
            expect(y.refrigerantRule.verdict, `${o.name} ${y.name}`).toBe('allowed');
            expect(y.refrigerant.safetyClass, `${o.name} ${y.name}`).toBe('A2L');
          }
          expect(
            direct.warnings.filter((w) => w.includes('Technology Transitions')),
            o.name,
          ).toEqual([]);
          // Every demo option passes the A2L room-size check on the space a leak spreads over
          // [PUB: IEC 60335-2-40:2018 Annex GG, reference §11]; the multi-zone systems are above m1 = 6 × LFL, so the
          // check is made (one explanation per indoor unit), not skipped.
          expect(
            direct.blockers.filter((b) => b.kind === 'a2l'),
            o.name,
          ).toEqual([]);
          for (const y of direct.systems) {
            const checks = y.explanations.filter((e) => e.key.startsWith(`${y.systemKey}:a2l:`));
            expect(checks.length, `${o.name} ${y.name}`).toBeGreaterThan(0);
            if (y.outdoorUnitKey.startsWith('TSL-M'))
              expect(
                checks.map((e) => e.key),
                `${o.name} ${y.name}`,
              ).not.toContain(`${y.systemKey}:a2l:m1`);
          }
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
          // Every demo option is sized as the trade would (the job with a discount waiting too): every head against its
          // zone's load and every outdoor unit against its system's, within the sizing policy's range (default policy:
          // variable-speed heat pump 90–130 % of the total cooling load [MEM: ACCA Manual S 2nd ed. Table N2]).
          for (const u of [...direct.zones, ...direct.systems])
            expect(u.sizing.withinRange, `${acct.company} ${o.name} ${u.name}: ${u.sizing.warnings.join(' | ')}`).toBe(
              true,
            );
          // A ductless head serves one room, or rooms that are one open space (common practice: its air does not
          // reach a closed room); several closed rooms share a ducted unit.
          for (const z of o.design.zones) {
            const head = data.catalog.indoorUnits.find((u) => u.key === z.indoorUnitKey);
            if (head && !isDuctedUnit(head) && z.roomIds.length > 1)
              expect(z.openSpace, `${o.name} ${z.name}: a ${head.unitType} serving ${z.roomIds.length} rooms`).toBe(
                true,
              );
          }
          if (isReady) {
            readyOptions += 1;
            // An option ready to propose is rated at the job's design temperature by the maker's own data.
            const coolingF = jobBody.designConditions.outdoorCoolingDryBulbF as number;
            const units = [
              ...direct.zones.map((z) => ({ name: z.name, key: z.indoorUnitKey, sizing: z.sizing })),
              ...direct.systems.map((y) => ({ name: y.name, key: y.outdoorUnitKey, sizing: y.sizing })),
            ];
            for (const u of units) {
              const what = `${acct.company} ${o.name} ${u.name} (${u.key})`;
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
