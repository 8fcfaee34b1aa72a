import type { ExplanationView } from '../model/result-view';

const tone: Record<ExplanationView['status'], string> = {
  ok: 'text-ink-900',
  note: 'text-ink-900',
  warning: 'text-amber-deep',
  blocker: 'text-danger',
};

/**
 * A computed number that opens to its why: the worked formula, the inputs, the verdict and the source,
 * as calc wrote them (the proposal and the installer's packet print the same words).
 */
export function Why({
  e,
  label = e.label,
  verdictShown = false,
}: {
  e: ExplanationView;
  label?: string;
  /** The verdict already stands in sight above (UnitWhys): the line does not repeat it. */
  verdictShown?: boolean;
}) {
  return (
    <details className="group rounded-md border border-line bg-white px-3 py-2">
      <summary className="flex min-h-touch cursor-pointer flex-wrap items-center justify-between gap-2">
        <span className="text-sm text-muted">
          {label}
          {e.verdict && e.status !== 'ok' && !verdictShown ? (
            <span className={`block font-semibold ${tone[e.status]}`}>{e.verdict}</span>
          ) : null}
        </span>
        <span className={`font-semibold tabular-nums ${tone[e.status]}`}>
          {e.valueText} <span className="text-sm font-normal text-ink-600 underline">why?</span>
        </span>
      </summary>
      <div className="mt-2 flex flex-col gap-2 text-sm">
        <p className="font-mono text-ink-900">{e.text}</p>
        {e.inputs.length > 0 ? (
          <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1">
            {e.inputs.map((i) => (
              <div key={i.label} className="contents">
                <dt className="text-muted">{i.label}</dt>
                <dd className="tabular-nums">{i.text}</dd>
              </div>
            ))}
          </dl>
        ) : null}
        {e.verdict && e.status === 'ok' ? <p className="font-semibold text-ok">{e.verdict}</p> : null}
        {e.source ? <p className="text-muted">Source: {e.source}</p> : null}
      </div>
    </details>
  );
}
