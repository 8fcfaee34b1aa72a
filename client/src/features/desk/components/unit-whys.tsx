import type { ExplanationView, SizingView } from '../model/result-view';
import { DeskFold } from './desk-fold';
import { SizingVerdict } from './sizing-verdict';
import { Why } from './why';

const TONE: Record<ExplanationView['status'], string> = {
  ok: 'font-semibold text-ok',
  note: 'text-ink-900',
  warning: 'font-semibold text-amber-deep',
  blocker: 'font-semibold text-danger',
};

/** calc's verdicts that always stay in sight: the sizing sentence, heating coverage and moisture removal. */
const ALWAYS = ['cooling-ratio', 'heating-coverage', 'latent'];

const sentence = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
const lower = (s: string) => s.charAt(0).toLowerCase() + s.slice(1);

/**
 * An indoor or outdoor unit's whys: its verdicts in plain words stay in sight (sizing, heating coverage, moisture
 * removal, and any figure calc warns about), and the figures themselves fold behind one line on a phone.
 */
export function UnitWhys({
  whys,
  sizing,
  name,
  pairedWith,
}: {
  whys: readonly ExplanationView[];
  sizing?: SizingView;
  /** Whose figures they are, for the fold's line (several units fold on one screen). */
  name: string;
  /** An indoor unit alone on its outdoor unit: rated as the pair, its verdicts may be the system's word for word. */
  pairedWith?: { name: string; whys: readonly ExplanationView[] };
}) {
  if (whys.length === 0) return sizing ? <SizingVerdict sizing={sizing} /> : null;
  const verdicts = whys.filter(
    (x) => x.verdict && (ALWAYS.some((k) => x.key.endsWith(k)) || x.status === 'warning' || x.status === 'blocker'),
  );
  // Said once: where the pair's outdoor unit says the same verdicts (same figure, same words), they stand under it.
  const sameAsPair =
    pairedWith !== undefined &&
    verdicts.length > 0 &&
    verdicts.every((v) => {
      const suffix = ALWAYS.find((k) => v.key.endsWith(k));
      return (
        suffix !== undefined &&
        pairedWith.whys.some((p) => p.key.endsWith(suffix) && p.verdict === v.verdict && p.valueText === v.valueText)
      );
    });
  const shown = new Set(sameAsPair ? [] : verdicts.map((x) => x.key));
  return (
    <div className="flex flex-col gap-1">
      {sameAsPair ? (
        <p className="text-sm text-ink-700">
          Rated as a pair with its outdoor unit: the verdicts stand under {pairedWith.name} below.
        </p>
      ) : verdicts.length > 0 ? (
        <ul className="flex flex-col gap-1 text-sm">
          {verdicts.map((x) => (
            <li key={x.key} className={TONE[x.status]}>
              {x.key.endsWith('cooling-ratio')
                ? sentence(x.verdict ?? '')
                : `${x.label.replace(`, ${name}`, '')}: ${x.valueText} — ${lower(x.verdict ?? '')}`}
            </li>
          ))}
        </ul>
      ) : sizing ? (
        <SizingVerdict sizing={sizing} />
      ) : null}
      <DeskFold
        summary={
          <span className="text-ink-700">
            Figures for {name} and their why ({whys.length})
          </span>
        }
      >
        <div className="flex flex-col gap-1">
          {whys.map((x) => (
            <Why key={x.key} e={x} verdictShown={shown.has(x.key)} />
          ))}
        </div>
      </DeskFold>
    </div>
  );
}
