import { useMutation, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import type { InstallPacket, PacketSystem } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { buttonClass } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-error';
import { installKeys, packetPdfPath, packetQueryOptions, requestPacketPdf } from '../api/packet';

/**
 * The job packet on a phone (issue 15): what was sold, for the people who build it — read with gloves on,
 * so large type, full-width targets and one column. No price anywhere (the server's schema has none).
 */

const oz = (n: number) => `${n.toFixed(1)} oz`;
const ft = (n: number) => `${Math.round(n * 100) / 100} ft`;
const btu = (n: number | null) => (n === null ? null : `${Math.round(n).toLocaleString('en-US')} Btu/h`);

function Caution({ c }: { c: InstallPacket['cautions'][number] }) {
  return (
    <div className="rounded-md border-l-4 border-amber-500 bg-amber-50 p-3 text-base">
      <p className="font-semibold text-amber-900">{c.title}</p>
      <p>{c.text}</p>
    </div>
  );
}

function Row({ label, value }: { label: string; value: string }) {
  return (
    <div className="flex justify-between gap-4 border-b border-line py-2 text-base">
      <dt className="text-ink-700">{label}</dt>
      <dd className="text-right font-semibold">{value}</dd>
    </div>
  );
}

function System({ s, n, cautions }: { s: PacketSystem; n: number; cautions: InstallPacket['cautions'] }) {
  const c = (key: InstallPacket['cautions'][number]['key']) => {
    const found = cautions.find((x) => x.key === key);
    return found ? <Caution c={found} /> : null;
  };
  const e = s.electrical;
  return (
    <section aria-labelledby={`sys-${n}`} className="space-y-4">
      <h2 id={`sys-${n}`} className="rounded-md bg-ink-800 px-3 py-2 text-xl font-bold text-white">
        System {n + 1}: {s.name}
      </h2>
      <dl>
        <Row label="Outdoor unit" value={`${s.outdoor.model} — ${s.outdoor.name}`} />
        <Row label="Refrigerant" value={s.a2l ? `${s.refrigerant} (A2L)` : s.refrigerant} />
        {s.heatKit ? <Row label="Heat kit" value={`${s.heatKit.model} — ${s.heatKit.name}`} /> : null}
      </dl>
      {s.a2l ? c('a2l') : null}
      <h3 className="text-lg font-semibold">Where each indoor unit goes</h3>
      <ul className="space-y-3">
        {s.indoorUnits.map((u) => (
          <li key={u.zoneName} className="rounded-md border border-line p-3">
            <p className="text-lg font-semibold">
              {u.zoneName}: {u.unit.model}
            </p>
            <p className="text-sm text-ink-700">
              {[u.unit.name, u.unit.kind, btu(u.unit.nominalCoolingBtuh)].filter(Boolean).join(' · ')}
            </p>
            {u.rooms.map((r) => (
              <div key={r.name} className="mt-2">
                <p className="font-semibold">Room: {r.name}</p>
                {r.notes ? <p className="whitespace-pre-line">{r.notes}</p> : null}
                {r.roomId === null ? <p className="text-sm text-ink-700">This room is no longer on the job.</p> : null}
                {r.photos.length ? (
                  <div className="mt-2 grid grid-cols-2 gap-2">
                    {r.photos.map((p, i) => (
                      <a key={p.id} href={p.url} target="_blank" rel="noreferrer" className="block min-h-12">
                        <img
                          src={p.url}
                          alt={`${r.name}, photo ${i + 1}`}
                          width={p.width}
                          height={p.height}
                          loading="lazy"
                          className="h-auto w-full rounded"
                        />
                      </a>
                    ))}
                  </div>
                ) : null}
              </div>
            ))}
          </li>
        ))}
      </ul>
      <h3 className="text-lg font-semibold">Line sets and the charge to weigh in</h3>
      {c('refrigerant')}
      <ul className="space-y-3">
        {s.lineSets.map((l, i) => (
          <li key={i} className="rounded-md border border-line p-3">
            <p className="text-lg font-semibold">{l.zoneName}</p>
            <dl>
              <Row label="Liquid / suction" value={`${l.liquid} in / ${l.suction} in`} />
              <Row label="Planned run" value={`${ft(l.plannedLengthFt)} (${l.kind === 'kit' ? 'kit' : 'field-cut'})`} />
              <Row label="Lift" value={ft(l.liftFt)} />
              <Row label="Add" value={oz(l.extraChargeOz)} />
              <Row
                label="Condensate"
                value={`${l.condensate.kind === 'pump' ? 'pump' : 'gravity'}, about ${ft(l.condensate.lengthFt)}`}
              />
            </dl>
            <p className="mt-2 text-sm">{l.extraChargeText}</p>
          </li>
        ))}
      </ul>
      <div className="grid grid-cols-2 gap-3 rounded-md border-2 border-ink-800 p-3">
        <p>
          <span className="block text-sm">Extra to weigh in</span>
          <span className="text-2xl font-bold">{oz(s.extraChargeOz)}</span>
        </p>
        <p>
          <span className="block text-sm">Total system charge</span>
          <span className="text-2xl font-bold">{oz(s.totalChargeOz)}</span>
        </p>
      </div>
      {c('pressureTest')}
      <h3 className="text-lg font-semibold">Electrical</h3>
      <dl>
        <Row label="Supply" value={`${e.supplyVoltage} V`} />
        <Row label="MCA / MOCP" value={`${e.mcaA} A / ${e.mocpA} A`} />
        <Row label="Breaker" value={e.breakerA === null ? 'Per the nameplate' : `${e.breakerA} A`} />
        <Row label="Conductors" value={e.wireAwg === null ? 'Per the nameplate' : `${e.wireAwg} AWG copper`} />
        <Row label="Circuit length" value={ft(e.circuitLengthFt)} />
        <Row label="Disconnect" value={`${e.disconnectA} A`} />
      </dl>
      {c('electrical')}
    </section>
  );
}

export function PacketPage({ jobId }: { jobId: string }) {
  const { data: p } = useSuspenseQuery(packetQueryOptions(jobId));
  const qc = useQueryClient();
  const ask = useMutation({
    mutationFn: () => requestPacketPdf(jobId),
    onSettled: () => qc.invalidateQueries({ queryKey: installKeys.packet(jobId) }),
  });
  const site = [p.site.street, p.site.unit, `${p.site.city}, ${p.site.region} ${p.site.postalCode}`].filter(Boolean);
  const busy = p.pdf.state === 'waiting' || p.pdf.state === 'rendering';
  return (
    <article className="mx-auto max-w-2xl space-y-6 text-base">
      <header className="space-y-1">
        <h1 className="text-2xl font-bold">Job packet</h1>
        <p className="text-lg font-semibold">{site.join(', ')}</p>
        <p>
          {p.customer.name}
          {p.customer.phone ? (
            <>
              {' · '}
              <a className="underline" href={`tel:${p.customer.phone}`}>
                {p.customer.phone}
              </a>
            </>
          ) : null}
        </p>
        <p className="text-sm text-ink-700">
          {p.sold.optionName}, signed {p.sold.signedAt.slice(0, 10)} (version {p.sold.versionNumber})
        </p>
      </header>
      <div className="flex flex-col gap-3">
        {p.pdf.state === 'ready' ? (
          <a className={buttonClass('primary', 'min-h-14 w-full text-lg')} href={`${packetPdfPath(jobId)}?download=1`}>
            Download the packet as a PDF
          </a>
        ) : null}
        <button
          type="button"
          className={buttonClass('secondary', 'min-h-14 w-full text-lg')}
          disabled={busy || ask.isPending}
          onClick={() => ask.mutate()}
        >
          {busy ? 'Making the PDF…' : p.pdf.state === 'ready' ? 'Make the PDF again' : 'Make a PDF of the packet'}
        </button>
        {p.pdf.state === 'failed' ? <Alert tone="danger">The PDF could not be made. Try again.</Alert> : null}
        {ask.error ? (
          <Alert tone="danger">
            {ask.error instanceof ApiError ? ask.error.message : 'The PDF was not asked for.'}
          </Alert>
        ) : null}
      </div>
      <div className="grid grid-cols-2 gap-3 rounded-md border-2 border-ink-800 p-3">
        <p>
          <span className="block text-sm">Extra to weigh in, all systems</span>
          <span className="text-2xl font-bold">{oz(p.extraChargeOz)}</span>
        </p>
        <p>
          <span className="block text-sm">Total charge, all systems</span>
          <span className="text-2xl font-bold">{oz(p.totalChargeOz)}</span>
        </p>
      </div>
      {p.jobNotes ? (
        <section className="rounded-md bg-ink-50 p-3">
          <h2 className="font-semibold">Notes from the walk-through</h2>
          <p className="whitespace-pre-line">{p.jobNotes}</p>
        </section>
      ) : null}
      <section className="space-y-3" aria-labelledby="before">
        <h2 id="before" className="text-xl font-bold">
          Before you start
        </h2>
        {p.cautions.map((c) => (
          <Caution key={c.key} c={c} />
        ))}
      </section>
      {p.systems.map((s, i) => (
        <System key={i} s={s} n={i} cautions={p.cautions} />
      ))}
      <section aria-labelledby="materials" className="space-y-2">
        <h2 id="materials" className="text-xl font-bold">
          Material list
        </h2>
        {p.materials.length === 0 ? (
          <p>The sold option lists no materials.</p>
        ) : (
          <ul className="divide-y divide-line">
            {p.materials.map((m, i) => (
              <li key={i} className="flex gap-3 py-3 text-base">
                <span className="w-20 shrink-0 font-semibold">
                  {m.quantity} {m.unit}
                </span>
                <span>{m.description}</span>
              </li>
            ))}
          </ul>
        )}
      </section>
    </article>
  );
}
