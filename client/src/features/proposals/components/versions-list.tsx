import { formatMoney } from '@calc';
import type { PdfState, ProposalVersionRecord } from '@contract';
import { formatStamp } from '../model/dates';

export const pdfStateWords: Record<PdfState, string> = {
  waiting: 'PDF waiting its turn',
  rendering: 'PDF being made',
  ready: 'PDF ready',
  failed: 'PDF could not be made',
};
const pdfStateTone: Record<PdfState, string> = {
  waiting: 'bg-ink-50 text-ink-800',
  rendering: 'bg-ink-50 text-ink-800',
  ready: 'bg-ok-soft text-ok',
  failed: 'bg-danger-soft text-danger',
};

/** The versions, newest first: who issued each and when, superseded or current, its PDF's state; one is shown. */
export function VersionsList({
  versions,
  shown,
  onShow,
}: {
  versions: readonly ProposalVersionRecord[];
  shown: number | null;
  onShow: (n: number) => void;
}) {
  return (
    <section aria-labelledby="versions-heading" className="flex flex-col gap-2">
      <h2 id="versions-heading" className="text-lg font-semibold text-ink-900">
        Versions
      </h2>
      <ol className="flex flex-col gap-2">
        {versions.map((v) => {
          const on = v.number === shown;
          return (
            <li key={v.number}>
              <button
                type="button"
                aria-pressed={on}
                onClick={() => onShow(v.number)}
                className={`flex w-full min-h-touch flex-col gap-1 rounded-lg border bg-white px-4 py-3 text-left ${
                  on ? 'border-ink-800 ring-2 ring-ink-800' : 'border-line hover:bg-ink-50'
                }`}
              >
                <span className="flex flex-wrap items-center gap-2">
                  <span className="text-base font-semibold text-ink-900">Version {v.number}</span>
                  <span
                    className={`rounded-full px-2 py-0.5 text-sm font-semibold ${
                      v.current ? 'bg-amber-soft text-amber-deep' : 'bg-ink-50 text-muted'
                    }`}
                  >
                    {v.current ? 'Current' : 'Superseded'}
                  </span>
                  <span className={`rounded-full px-2 py-0.5 text-sm font-semibold ${pdfStateTone[v.pdf.state]}`}>
                    {pdfStateWords[v.pdf.state]}
                  </span>
                </span>
                <span className="text-sm text-ink-950">
                  Issued by {v.issuedBy.name} on {formatStamp(v.issuedAt)}
                  {v.supersededAt ? ` · superseded on ${formatStamp(v.supersededAt)}` : ''}
                </span>
                <span className="text-sm text-muted">
                  {v.options.map((o) => `${o.name} ${formatMoney(o.totalCents, { whole: true })}`).join(' · ')}
                </span>
              </button>
            </li>
          );
        })}
      </ol>
    </section>
  );
}
