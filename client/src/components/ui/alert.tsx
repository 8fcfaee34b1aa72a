import type { ReactNode } from 'react';

type Tone = 'danger' | 'warning' | 'info' | 'ok';

const tones: Record<Tone, string> = {
  danger: 'border-danger bg-danger-soft text-danger',
  warning: 'border-amber-line bg-amber-soft text-amber-deep',
  info: 'border-ink-200 bg-ink-50 text-ink-800',
  ok: 'border-ok bg-ok-soft text-ok',
};

export function Alert({ tone = 'info', title, children }: { tone?: Tone; title?: string; children?: ReactNode }) {
  const urgent = tone === 'danger' || tone === 'warning';
  return (
    <div role={urgent ? 'alert' : 'status'} className={`rounded-md border-l-4 px-4 py-3 text-base ${tones[tone]}`}>
      {title ? <p className="font-semibold">{title}</p> : null}
      {children ? <div className="text-ink-950">{children}</div> : null}
    </div>
  );
}
