import { formatNumber, formatPercent, formatQuantity } from '@calc';
import type { DeskModel } from '../api/get-models';
import type { ExplanationView, SystemView, ZoneView } from '../model/result-view';
import { Cautions } from './cautions';
import { DeskFold } from './desk-fold';
import { UnitWhys } from './unit-whys';
import { Why } from './why';

const modelName = (models: readonly DeskModel[], key: string) => {
  const m = models.find((x) => x.key === key);
  return m ? `${m.key} — ${m.name}` : key;
};

function Messages({ items, tone }: { items: readonly string[]; tone: 'warning' | 'blocker' }) {
  if (items.length === 0) return null;
  return (
    <ul className={`list-disc pl-5 text-sm ${tone === 'blocker' ? 'text-danger' : 'text-amber-deep'}`}>
      {[...new Set(items)].map((w) => (
        <li key={w}>
          {tone === 'blocker' ? 'Stops “ready to propose”: ' : ''}
          {w}
        </li>
      ))}
    </ul>
  );
}

/**
 * A branch circuit's sizes in one line (breaker, wire, voltage drop) with the electrical caution beside them; how
 * each size was found folds behind one line on a phone.
 */
function ElectricalBlock({
  title,
  e,
  whys,
}: {
  title: string;
  e: NonNullable<SystemView['electrical']>;
  whys: readonly ExplanationView[];
}) {
  return (
    <div className="flex flex-col gap-2">
      <h5 className="text-sm font-semibold uppercase tracking-wide text-muted">{title}</h5>
      <p className="text-sm tabular-nums">
        MCA {formatNumber(e.mcaA, 1)} A, MOCP {formatNumber(e.mocpA)} A → breaker{' '}
        <strong>{e.breakerA === null ? '—' : `${formatNumber(e.breakerA)} A`}</strong>, wire{' '}
        <strong>{e.wireAwg === null ? '—' : `${e.wireAwg} AWG`}</strong>
        {e.voltageDropPercent === null || e.voltageDropPercent === undefined
          ? ''
          : `, voltage drop ${formatPercent(e.voltageDropPercent, 1)}${e.circuitLengthFt === undefined ? '' : ` over ${formatNumber(e.circuitLengthFt)} ft${e.circuitLengthAssumed ? ' (assumed)' : ''}`}`}
        {e.disconnectA === undefined ? '' : `; disconnect ${formatNumber(e.disconnectA)} A`}
        {e.disconnectRun
          ? e.disconnectRun.kind === 'whip'
            ? ` with a ${formatNumber(e.disconnectRun.lengthFt)} ft whip`
            : ` with ${formatNumber(e.disconnectRun.lengthFt)} ft of liquid-tight conduit`
          : ''}
        .
      </p>
      {whys.length > 0 ? (
        <DeskFold summary={<span className="text-ink-700">How each size was found ({whys.length})</span>}>
          <div className="flex flex-col gap-1">
            {whys.map((x) => (
              <Why key={x.key} e={x} />
            ))}
          </div>
        </DeskFold>
      ) : null}
      <Messages items={e.warnings} tone="warning" />
      <Cautions title={title} items={e.caution ? [e.caution] : []} />
    </div>
  );
}

/** One outdoor unit and what hangs off it: sizing, ports, each circuit's charge, the total, the electrical, with their whys. */
export function SystemResults({
  system,
  zones,
  models,
}: {
  system: SystemView;
  zones: readonly ZoneView[];
  models: readonly DeskModel[];
}) {
  const r = system.refrigerant;
  const e = system.electrical;
  // calc lists the system's whys together and again under refrigerant and electrical: each is shown once.
  const shown = new Set<string>();
  const once = (xs: readonly ExplanationView[]) =>
    xs.filter((x) => {
      if (shown.has(x.key)) return false;
      shown.add(x.key);
      return true;
    });
  const circuitWhys = once((r?.circuits ?? []).flatMap((c) => (c.explanation ? [c.explanation] : [])));
  const chargeWhys = once(r?.explanations ?? []);
  const electricalWhys = once(e?.explanations ?? []);
  const kit = system.heatKitElectrical;
  const kitWhys = once(kit?.explanations ?? []);
  const otherWhys = once(system.explanations);
  const chargeCount = (r?.circuits.length ?? 0) + chargeWhys.length + (r?.notes.length ?? 0);
  const a2l = chargeWhys.some((x) => x.key.includes('a2l'));
  const zoneName = (key: string) => zones.find((z) => z.zoneKey === key)?.name ?? key;
  return (
    <section
      aria-label={`System ${system.name}`}
      className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4"
    >
      <h4 className="text-base font-semibold text-ink-900">
        {system.name}: {modelName(models, system.outdoorUnitKey)}
      </h4>
      <UnitWhys whys={otherWhys} sizing={system.sizing} name={system.name} />
      {system.combination?.multiZone ? (
        <p className={`text-sm ${system.combination.ok ? 'text-ink-900' : 'font-semibold text-danger'}`}>
          {system.combination.heads} of {system.combination.maxHeads} ports used; indoor units connected{' '}
          {formatPercent(system.combination.connectedPercent)} of the outdoor unit’s nominal (the maker allows{' '}
          {formatPercent(system.combination.allowedPercent.min)}–{formatPercent(system.combination.allowedPercent.max)}
          ).
        </p>
      ) : null}
      {system.combination ? <Messages items={system.combination.warnings} tone="warning" /> : null}

      {r ? (
        <div className="flex flex-col gap-2">
          <h5 className="text-sm font-semibold uppercase tracking-wide text-muted">
            Lines and charge ({r.refrigerant}
            {r.safetyClass ? `, ${r.safetyClass}` : ''})
          </h5>
          <p className="text-sm tabular-nums">
            Total extra charge <strong>{formatQuantity(r.extraChargeOz, 'oz', 1)}</strong>; factory charge{' '}
            {formatQuantity(r.factoryChargeOz, 'oz', 1)}; total system charge{' '}
            <strong>{formatQuantity(r.totalChargeOz, 'oz', 1)}</strong>; total line length{' '}
            {formatQuantity(r.totalLengthFt, 'ft')}.
          </p>
          <Messages items={[...r.blockers, ...r.circuits.flatMap((c) => c.blockers)]} tone="blocker" />
          <Messages items={[...r.warnings, ...r.circuits.flatMap((c) => c.warnings)]} tone="warning" />
          <DeskFold
            summary={
              <span className="text-ink-700">
                Each circuit’s charge{a2l ? ', the A2L room checks' : ''} and their why ({chargeCount})
              </span>
            }
          >
            <div className="flex flex-col gap-1">
              {r.circuits.map((c) =>
                c.explanation && circuitWhys.includes(c.explanation) ? (
                  <Why
                    key={c.zoneKey}
                    e={c.explanation}
                    label={`${zoneName(c.zoneKey)}: ${formatQuantity(c.lengthFt, 'ft')} run, ${formatQuantity(c.liftFt, 'ft')} lift — extra charge`}
                  />
                ) : (
                  <p key={c.zoneKey} className="text-sm">
                    {zoneName(c.zoneKey)}: extra charge {formatQuantity(c.extraChargeOz, 'oz', 1)}
                  </p>
                ),
              )}
              {chargeWhys.map((x) => (
                <Why key={x.key} e={x} />
              ))}
              {r.notes.map((n) => (
                <p key={n} className="text-sm text-muted">
                  {n}
                </p>
              ))}
            </div>
          </DeskFold>
          <Cautions title="Refrigerant and pressure work" items={r.cautions} />
        </div>
      ) : null}

      {e ? <ElectricalBlock title="Electrical" e={e} whys={electricalWhys} /> : null}
      {kit ? <ElectricalBlock title="Electrical, heat kit" e={kit} whys={kitWhys} /> : null}
    </section>
  );
}
