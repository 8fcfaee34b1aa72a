import { formatMoney, formatPercent } from '@calc';
import { taxOverrideSchema, type OptionRecord } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { errorMessage } from '../../../lib/api-error';
import { useDecideDiscount } from '../api/decide-discount';
import type { ExplanationView } from '../model/result-view';
import { DeskFold } from './desk-fold';
import { Why } from './why';

function Row({
  label,
  cents,
  why,
  strong = false,
}: {
  label: string;
  cents: number;
  why?: ExplanationView;
  strong?: boolean;
}) {
  if (why) return <Why e={why} label={label} />;
  return (
    <div className="flex min-h-touch items-center justify-between gap-2 px-3">
      <span className="text-sm text-muted">{label}</span>
      <span className={`tabular-nums ${strong ? 'text-lg font-semibold' : ''}`}>{formatMoney(cents)}</span>
    </div>
  );
}

/** The discount waiting for the owner (or decided), in plain words; the owner decides here. */
function DiscountRequest({ jobId, option, owner }: { jobId: string; option: OptionRecord; owner: boolean }) {
  const decide = useDecideDiscount(jobId);
  const req = option.discountRequest;
  if (!req) return null;
  const what = `${formatPercent(req.percent, 1)} asked by ${req.requestedBy.name}; their limit is ${formatPercent(req.limitPercent)}`;
  if (req.state === 'pending')
    return (
      <Alert tone="warning" title="Discount awaiting the owner’s approval">
        <p>{what}. It is not in the price until the owner approves it.</p>
        {owner ? (
          <div className="mt-2 flex flex-wrap gap-2">
            <Button busy={decide.isPending} onClick={() => decide.mutate({ option, approve: true })}>
              Approve discount
            </Button>
            <Button
              variant="secondary"
              disabled={decide.isPending}
              onClick={() => decide.mutate({ option, approve: false })}
            >
              Deny
            </Button>
          </div>
        ) : null}
        {decide.isError ? <p className="mt-2 text-danger">{errorMessage(decide.error)}</p> : null}
      </Alert>
    );
  return (
    <p className="text-sm text-muted">
      Discount {req.state === 'approved' ? 'approved' : 'denied'} by {req.decidedBy?.name ?? 'the owner'}: {what}.
    </p>
  );
}

/** The financing plans' monthly estimates, folded on a phone to the lowest one. */
function Monthly({
  plans,
  why,
}: {
  plans: NonNullable<OptionRecord['result']>['monthly'];
  why: (key: string) => ExplanationView | undefined;
}) {
  const lowest = Math.min(...plans.map((m) => m.monthlyPaymentCents));
  return (
    <DeskFold
      className="mt-2 px-3"
      summary={
        <span className="font-semibold text-ink-900">
          Monthly, with financing: from {formatMoney(lowest)} a month
          <span className="font-normal text-muted">
            {' '}
            ({plans.length} {plans.length === 1 ? 'plan' : 'plans'})
          </span>
        </span>
      }
    >
      <div className="flex flex-col gap-1">
        {plans.map((m) => {
          const w = why(`monthly:${m.planKey}`);
          return w ? (
            <Why key={m.planKey} e={w} label={m.name} />
          ) : (
            <p key={m.planKey} className="flex justify-between gap-2 text-sm">
              <span>{m.name}</span>
              <span className="tabular-nums">{formatMoney(m.monthlyPaymentCents)} / month</span>
            </p>
          );
        })}
      </div>
    </DeskFold>
  );
}

/**
 * The option's price as the role may see it (the server leaves out cost and margin for salespeople and
 * every figure for installers). Numbers open to calc's why where the server sends it.
 */
export function PricePanel({
  jobId,
  option,
  whys,
  owner,
}: {
  jobId: string;
  option: OptionRecord;
  whys: ReadonlyMap<string, ExplanationView>;
  owner: boolean;
}) {
  const p = option.result?.price;
  if (!p) return null;
  const override = taxOverrideSchema.safeParse(option.pricing?.tax);
  const tax = override.success ? override.data : null;
  const why = (k: string) => whys.get(`${option.id}:price:${k}`) ?? whys.get(`price:${k}`);
  return (
    <div className="flex flex-col gap-1">
      {p.costCents !== undefined ? (
        <>
          <Row label="Equipment cost" cents={p.equipmentCostCents ?? 0} why={why('equipment')} />
          <Row label="Materials cost" cents={p.materialsCostCents ?? 0} why={why('materials')} />
          <Row label="Labor cost" cents={p.laborCostCents ?? 0} why={why('labor')} />
          {p.sellRule ? (
            <p className="px-3 text-sm text-muted">
              Sold at {formatPercent(p.sellRule.percent, 1)} {p.sellRule.method}
            </p>
          ) : null}
        </>
      ) : null}
      <Row label="Price before discounts" cents={p.sellCents} why={why('sell')} />
      {p.discountCents > 0 ? (
        <Row
          label={`Discounts (${formatPercent(p.discountPercent, 1)})`}
          cents={-p.discountCents}
          why={why('discount')}
        />
      ) : null}
      <Row label="Subtotal" cents={p.subtotalCents} why={why('subtotal')} />
      <Row label="Tax" cents={p.taxCents} why={why('tax')} />
      {tax ? (
        <p className="px-3 text-sm text-muted">
          {tax.taxOn === 'none' ? 'Tax exempt' : `This option’s own tax: ${formatPercent(tax.taxRatePercent, 2)}`} —{' '}
          {tax.reason}
        </p>
      ) : null}
      <Row label="Total" cents={p.totalCents} why={why('total')} strong />
      <Row label="Deposit" cents={p.depositCents} why={why('deposit')} />
      <Row label="Balance" cents={p.balanceCents} why={why('balance')} />
      {p.grossMarginCents !== undefined && why('gross-margin') ? (
        <Row label="Gross margin" cents={p.grossMarginCents} why={why('gross-margin')} />
      ) : null}
      {p.grossMarginCents !== undefined && why('gross-margin-percent') ? (
        <Row label="Gross margin, percent" cents={0} why={why('gross-margin-percent')} />
      ) : null}
      {p.grossMarginCents !== undefined && !why('gross-margin') ? (
        <div className="flex min-h-touch items-center justify-between gap-2 px-3">
          <span className="text-sm text-muted">Gross margin</span>
          <span className="tabular-nums">
            {formatMoney(p.grossMarginCents)} ({formatPercent(p.grossMarginPercent ?? 0, 1)})
          </span>
        </div>
      ) : null}
      {option.result && option.result.monthly.length > 0 ? <Monthly plans={option.result.monthly} why={why} /> : null}
      <DiscountRequest jobId={jobId} option={option} owner={owner} />
    </div>
  );
}
