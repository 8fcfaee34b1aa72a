import type { EntityManager } from '@mikro-orm/postgresql';
import { CAUTIONS, REFRIGERANT_INFO } from '@calc';
import type { InstallPacket, PacketSystem, SnapshotOption } from '@contract';
import { ConflictError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import { assertInstallerMayOpen, soldOption, type SoldOption } from './assignment';

/**
 * The installer's job packet (issue 15): the option the customer signed for, read from the signed version's
 * frozen snapshot (never the live desk), with the rooms' notes and photos as the job holds them now. Built
 * field by field into the contract's strict `installPacket`: nothing of the snapshot's price, the takeoff's
 * sell prices, the monthly plans or the deposit is ever copied.
 */

const CAUTION_TITLES: Record<InstallPacket['cautions'][number]['key'], string> = {
  makerAndCode: "The maker's instructions and local codes govern",
  refrigerant: 'Refrigerant work: certified technicians only',
  pressureTest: 'Pressure test: dry nitrogen only',
  a2l: 'A2L refrigerant',
  electrical: 'Electrical: the licensed trade',
  estimate: 'These are the sold figures, not a measurement',
};

/**
 * The cautions beside refrigerant, pressure and electrical figures (DESIGN.md Safety; issue 15's list), in
 * calc's wording with its stable keys. The pressure-test one adds the nameplate or manual, which names the
 * test pressure; A2L only where a system's refrigerant is A2L.
 */
export function packetCautions(anyA2l: boolean): InstallPacket['cautions'] {
  const keys = [
    'makerAndCode',
    'refrigerant',
    'pressureTest',
    ...(anyA2l ? (['a2l'] as const) : []),
    'electrical',
    'estimate',
  ] as const;
  return keys.map((key) => ({
    key,
    title: CAUTION_TITLES[key],
    text:
      key === 'pressureTest'
        ? `${CAUTIONS.pressureTest} The test pressure is the one the equipment's nameplate or installation manual gives.`
        : CAUTIONS[key],
  }));
}

/** Whether a snapshot's refrigerant name is one calc knows as A2L (R-32, R-454B). */
export function isA2lName(refrigerant: string): boolean {
  const info = (REFRIGERANT_INFO as Record<string, { safetyClass: string } | undefined>)[refrigerant];
  return info?.safetyClass === 'A2L';
}

const model = (m: SnapshotOption['systems'][number]['outdoor']) => ({
  model: m.key,
  name: m.name,
  kind: m.kind,
  nominalCoolingBtuh: m.nominalCoolingBtuh,
  nominalHeatingBtuh: m.nominalHeatingBtuh,
});

interface RoomRow {
  id: string;
  name: string;
  notes: string;
  photos: { id: string; width: number; height: number }[] | null;
}

/** The job's rooms now, by name (the sold design names the rooms each indoor unit serves). */
async function roomsByName(em: EntityManager, companyId: string, jobId: string): Promise<Map<string, RoomRow>> {
  const rows = await em.execute<RoomRow[]>(
    `select r."id", r."input"->>'name' as "name", coalesce(r."input"->>'notes', '') as "notes",
            (select json_agg(json_build_object('id', ph."id", 'width', ph."width", 'height', ph."height")
                      order by ph."created_at", ph."id")
               from "photo" ph where ph."room_id" = r."id") as "photos"
       from "room" r join "job" j on j."id" = r."job_id"
      where j."company_id" = ? and r."job_id" = ? order by r."position", r."id"`,
    [companyId, jobId],
  );
  const map = new Map<string, RoomRow>();
  for (const r of rows) if (!map.has(r.name)) map.set(r.name, r);
  return map;
}

/** The packet's content from the sold option (pure but for the rooms read beside it). */
export function packetSystems(jobId: string, option: SnapshotOption, rooms: Map<string, RoomRow>): PacketSystem[] {
  return option.systems.map((s) => ({
    name: s.name,
    refrigerant: s.refrigerant,
    a2l: isA2lName(s.refrigerant),
    outdoor: model(s.outdoor),
    indoorUnits: s.zones.map((z) => ({
      zoneName: z.name,
      unit: model(z.indoor),
      rooms: z.rooms.map((name) => {
        const room = rooms.get(name);
        return {
          name,
          roomId: room?.id ?? null,
          notes: room?.notes ?? '',
          photos: (room?.photos ?? []).map((ph) => ({
            id: ph.id,
            url: `/api/jobs/${jobId}/rooms/${room!.id}/photos/${ph.id}`,
            width: ph.width,
            height: ph.height,
          })),
        };
      }),
    })),
    lineSets: s.lineSets.map((l) => ({
      zoneName: l.zoneName,
      liquid: l.liquid,
      suction: l.suction,
      plannedLengthFt: l.lengthFt,
      installedLengthFt: l.installedLengthFt,
      kind: l.kind,
      liftFt: l.liftFt,
      extraChargeOz: l.extraChargeOz,
      extraChargeText: l.extraChargeText,
      condensate: { kind: l.condensate.kind, lengthFt: l.condensate.lengthFt },
    })),
    extraChargeOz: s.extraChargeOz,
    totalChargeOz: s.totalChargeOz,
    electrical: {
      supplyVoltage: s.electrical.supplyVoltage,
      mcaA: s.electrical.mcaA,
      mocpA: s.electrical.mocpA,
      breakerA: s.electrical.breakerA,
      wireAwg: s.electrical.wireAwg,
      circuitLengthFt: s.electrical.circuitLengthFt,
      disconnectA: s.electrical.disconnectA,
    },
    heatKit: s.heatKit ? model(s.heatKit) : null,
  }));
}

/** Sums to one decimal (ounces as the snapshot gives them), so 2.2 + 4.1 reads 6.3, not 6.299999. */
const sumOz = (xs: number[]) => Math.round(xs.reduce((a, b) => a + b, 0) * 10) / 10;

export interface PacketPdfState {
  state: InstallPacket['pdf']['state'];
  sha256: string | null;
}

export async function packetPdfState(em: EntityManager, companyId: string, jobId: string): Promise<PacketPdfState> {
  const [row] = await em.execute<{ state: PacketPdfState['state']; sha256: string | null }[]>(
    'select "state", "sha256" from "install_packet_pdf" where "company_id" = ? and "job_id" = ?',
    [companyId, jobId],
  );
  return row ? { state: row.state, sha256: row.sha256 } : { state: 'none', sha256: null };
}

/** The packet as it leaves the server (strict schema; no money anywhere). */
export function composePacket(
  job: { id: string; status: InstallPacket['status']; notes: string },
  sold: SoldOption,
  rooms: Map<string, RoomRow>,
  pdf: PacketPdfState,
): InstallPacket {
  const { snapshot, option } = sold;
  const systems = packetSystems(job.id, option, rooms);
  return {
    jobId: job.id,
    status: job.status,
    company: { name: snapshot.company.name, phone: snapshot.company.phone },
    customer: { name: snapshot.customer.name, phone: snapshot.customer.phone },
    site: {
      street: snapshot.site.street,
      unit: snapshot.site.unit,
      city: snapshot.site.city,
      region: snapshot.site.region,
      postalCode: snapshot.site.postalCode,
    },
    sold: { versionNumber: sold.versionNumber, optionName: option.name, signedAt: sold.signedAt.toISOString() },
    jobNotes: job.notes,
    systems,
    extraChargeOz: sumOz(systems.map((s) => s.extraChargeOz)),
    totalChargeOz: sumOz(systems.map((s) => s.totalChargeOz)),
    materials: option.takeoff.flatMap((l) =>
      l.category === 'labor'
        ? []
        : [{ description: l.description, quantity: l.quantity, unit: l.unit, category: l.category }],
    ),
    cautions: packetCautions(systems.some((s) => s.a2l)),
    pdf: { state: pdf.state, sha256: pdf.sha256 },
  };
}

export interface PacketSource {
  job: { id: string; status: InstallPacket['status']; notes: string; companyId: string };
  sold: SoldOption;
  rooms: Map<string, RoomRow>;
}

/** What the packet is made from, for a company's job (the PDF's task reads it without an actor). */
export async function packetSource(em: EntityManager, companyId: string, jobId: string): Promise<PacketSource> {
  const sold = await soldOption(em, companyId, jobId);
  if (!sold)
    throw new ConflictError(
      'This job has no signed proposal: the packet is made from the option the customer signed for.',
    );
  const [job] = await em.execute<{ id: string; status: InstallPacket['status']; notes: string }[]>(
    'select "id", "status", "notes" from "job" where "company_id" = ? and "id" = ?',
    [companyId, jobId],
  );
  return { job: { ...job!, companyId }, sold, rooms: await roomsByName(em, companyId, jobId) };
}

/** GET /api/jobs/:jobId/packet: 404 outside the actor's scope (installers: assigned jobs), 409 with no signed option. */
export async function getPacket(ctx: ServiceContext, jobId: string): Promise<InstallPacket> {
  const job = await assertInstallerMayOpen(ctx.em, ctx.actor, jobId);
  const src = await packetSource(ctx.em, job.companyId, job.id);
  return composePacket(src.job, src.sold, src.rooms, await packetPdfState(ctx.em, job.companyId, job.id));
}
