import type { CustomerOption } from '@contract';
import { Button } from '../../../components/ui/button';
import { groupedNumber } from '../../../lib/grouped-number';
import { money } from './format';

type Model = CustomerOption['systems'][number]['outdoor'];

function ratings(m: Model): string | null {
  const parts = [
    m.seer2 !== null ? `SEER2 ${m.seer2}` : null,
    m.eer2 !== null ? `EER2 ${m.eer2}` : null,
    m.hspf2 !== null ? `HSPF2 ${m.hspf2}` : null,
  ].filter(Boolean);
  return parts.length ? parts.join(' · ') : null;
}

function Equipment({ option }: { option: CustomerOption }) {
  return (
    <ul className="space-y-3">
      {option.systems.map((s, i) => (
        <li key={`${i}-${s.name}`}>
          <p className="font-semibold text-ink-900">{s.outdoor.name}</p>
          <p className="text-sm text-muted">
            Model {s.outdoor.modelNumber}
            {s.outdoor.coolingBtuh !== null ? ` · ${groupedNumber(s.outdoor.coolingBtuh)} Btu/h cooling` : ''}
          </p>
          {ratings(s.outdoor) ? <p className="text-sm text-ink-800">Efficiency: {ratings(s.outdoor)}</p> : null}
          <ul className="mt-1 space-y-1 border-l-2 border-ink-100 pl-3">
            {s.zones.map((z, j) => (
              <li key={`${j}-${z.name}`} className="text-sm">
                <span className="font-semibold">{z.rooms.join(', ') || z.name}:</span> {z.indoor.name}{' '}
                <span className="text-muted">({z.indoor.modelNumber})</span>
              </li>
            ))}
          </ul>
          {s.heatKit ? <p className="mt-1 text-sm">Backup heat: {s.heatKit.name}</p> : null}
        </li>
      ))}
    </ul>
  );
}

/** One option as the customer compares it: price first, then monthly estimates, equipment and what is included. */
export function OptionCard({
  option,
  chosen,
  anyChosen,
  signed = false,
  busy,
  onChoose,
}: {
  option: CustomerOption;
  chosen: boolean;
  anyChosen: boolean;
  /** Signed: the choice is settled, so no card offers to change it. */
  signed?: boolean;
  busy: boolean;
  onChoose: () => void;
}) {
  const p = option.price;
  const headingId = `option-${option.position}-name`;
  return (
    <article
      aria-labelledby={headingId}
      className={`flex flex-col rounded-lg border-2 bg-white p-4 shadow-card sm:p-5 ${chosen ? 'border-ok' : 'border-line'}`}
    >
      <p className="text-sm font-semibold uppercase tracking-wide text-muted">Option {option.position}</p>
      <h3 id={headingId} className="text-xl font-semibold text-ink-900">
        {option.name}
      </h3>
      <p className="mt-3 text-3xl font-semibold text-ink-950 tabular-nums">{money(p.totalCents)}</p>
      <p className="text-sm text-muted">
        Total, including {money(p.taxCents)} tax
        {p.discountCents > 0 ? ` and a ${money(p.discountCents)} discount off ${money(p.beforeDiscountCents)}` : ''}
      </p>
      {p.depositCents > 0 ? (
        <p className="mt-2 text-base">
          <strong>{money(p.depositCents)}</strong> deposit when you sign, then {money(p.balanceCents)}
        </p>
      ) : (
        <p className="mt-2 text-base">No deposit: {money(p.balanceCents)} when the work is done</p>
      )}
      {option.monthly.length ? (
        <div className="mt-3 rounded-md bg-ink-50 p-3">
          <p className="text-sm font-semibold text-ink-800">Or pay monthly (estimates)</p>
          <ul className="mt-1 space-y-1 text-base">
            {option.monthly.map((m) => (
              <li key={m.name}>
                <strong className="tabular-nums">{money(m.monthlyPaymentCents)}</strong> a month ·{' '}
                <span className="text-ink-800">
                  {m.months} months at {m.aprPercent} % APR
                </span>
              </li>
            ))}
          </ul>
          <p className="mt-1 text-sm text-muted">The lender sets the final terms if you finance.</p>
        </div>
      ) : null}
      <h4 className="mt-4 text-base font-semibold text-ink-900">Equipment</h4>
      <div className="mt-1">
        <Equipment option={option} />
      </div>
      <details className="mt-4 rounded-md border border-line">
        <summary className="min-h-touch cursor-pointer px-3 py-2 text-base font-semibold text-ink-800">
          What is included ({option.included.length})
        </summary>
        <ul className="list-disc space-y-1 px-3 pb-3 pl-8 text-base">
          {option.included.map((line, i) => (
            <li key={`${i}-${line}`}>{line}</li>
          ))}
        </ul>
      </details>
      <div className="mt-auto pt-4">
        {chosen ? (
          <p className="flex min-h-touch items-center justify-center rounded-md bg-ok-soft px-4 text-base font-semibold text-ok">
            {signed ? '✓ Signed' : '✓ Your choice'}
          </p>
        ) : signed ? null : (
          <Button className="w-full" variant={anyChosen ? 'secondary' : 'primary'} busy={busy} onClick={onChoose}>
            {anyChosen ? `Choose ${option.name} instead` : `Choose ${option.name}`}
          </Button>
        )}
      </div>
    </article>
  );
}
