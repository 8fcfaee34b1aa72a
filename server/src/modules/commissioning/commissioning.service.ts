import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import {
  A2L_CAUTION,
  ADDITIVE_CAUTION,
  COMMISSIONING_CAUTIONS,
  DEFAULT_STARTUP_READINGS,
  type CommissioningPatch,
  type CommissioningRecord,
  type EvacuationInput,
  type EvacuationPolicyInput,
  type EvacuationPolicyRecord,
  type PressureTestInput,
  type RefrigerantEntryInput,
  type SnapshotOption,
} from '@contract';
import {
  ASTM_B280_ANNEALED,
  DEFAULT_EVACUATION_POLICY,
  EVACUATION_POLICY_BASIS,
  LIQUID_DENSITY_100F_LB_FT3,
  evacuationReading,
  liquidLineChargeOzPerFt,
  recomputedExtraCharge,
  standingTestReading,
  tubeLabel,
  isA2l,
  REFRIGERANT_INFO,
  type Refrigerant,
} from '@calc';
import { ConflictError, ValidationError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import type { Storage } from '../../services/storage';
import { assertVersion } from '../../lib/version-lock';
import { checkSignatureImage } from '../signing/signature-image';
import { openJob, soldOptionOf } from './access';

/** The record's parts as stored (the contract's inputs). */
const EMPTY_PRESSURE: PressureTestInput = {
  testGas: null,
  testPsig: null,
  gaugeResolutionPsi: null,
  startPsig: null,
  startF: null,
  endPsig: null,
  endF: null,
  holdMinutes: null,
};
const EMPTY_EVACUATION: EvacuationInput = {
  reachedMicrons: null,
  afterHoldMicrons: null,
  holdMinutes: null,
  holdReadings: [],
};

interface RecordRow {
  id: string;
  version: number;
  pressure_test: PressureTestInput;
  leaks: CommissioningRecord['leaks'];
  evacuation: EvacuationInput;
  measured_lines: CommissioningRecord['measuredLines'];
  startup: CommissioningRecord['startup'];
  notes: string;
  signed_off_by_name: string | null;
  cert_number: string | null;
  customer_name: string | null;
  installed_at: Date | string | null;
}

const iso = (d: Date | string) => (d instanceof Date ? d : new Date(d)).toISOString();

/** The company's evacuation policy (the UL-derived defaults until the owner saves one). */
export async function policyOf(em: EntityManager, companyId: string): Promise<EvacuationPolicyRecord> {
  const rows = await em.execute<
    {
      target_microns: number;
      max_rise_to_microns: number;
      hold_minutes: number;
      startup_readings: string[];
      ask_lot: boolean;
      version: number;
    }[]
  >(`select * from "commissioning_policy" where "company_id" = ?`, [companyId]);
  const r = rows[0];
  if (!r)
    return {
      ...DEFAULT_EVACUATION_POLICY,
      startupReadings: [...DEFAULT_STARTUP_READINGS],
      askLot: false,
      version: 0,
      isDefault: true,
      basis: EVACUATION_POLICY_BASIS,
    };
  return {
    targetMicrons: r.target_microns,
    maxRiseToMicrons: r.max_rise_to_microns,
    holdMinutes: r.hold_minutes,
    startupReadings: r.startup_readings,
    askLot: r.ask_lot,
    version: r.version,
    isDefault: false,
    basis: EVACUATION_POLICY_BASIS,
  };
}

export async function putPolicy(
  { em, actor, clock }: ServiceContext,
  version: number,
  input: EvacuationPolicyInput,
): Promise<EvacuationPolicyRecord> {
  if (input.maxRiseToMicrons < input.targetMicrons)
    throw new ValidationError([
      { path: 'maxRiseToMicrons', message: 'The rise limit cannot be below the target the pump must reach.' },
    ]);
  return em.transactional(async (tx) => {
    await tx.execute(`select pg_advisory_xact_lock(hashtext('commissioning_policy:' || ?))`, [actor.companyId]);
    const current = await policyOf(tx, actor.companyId);
    assertVersion(version, current.version, 'The evacuation policy', () => current);
    const values = [
      input.targetMicrons,
      input.maxRiseToMicrons,
      input.holdMinutes,
      JSON.stringify(input.startupReadings),
      input.askLot,
      clock.now(),
    ];
    if (current.version === 0)
      await tx.execute(
        `insert into "commissioning_policy" ("id", "company_id", "target_microns", "max_rise_to_microns", "hold_minutes",
           "startup_readings", "ask_lot", "updated_at") values (?, ?, ?, ?, ?, ?::jsonb, ?, ?)`,
        [randomUUID(), actor.companyId, ...values],
      );
    else
      await tx.execute(
        `update "commissioning_policy" set "target_microns" = ?, "max_rise_to_microns" = ?, "hold_minutes" = ?,
           "startup_readings" = ?::jsonb, "ask_lot" = ?, "updated_at" = ?, "version" = "version" + 1
         where "company_id" = ?`,
        [...values, actor.companyId],
      );
    return policyOf(tx, actor.companyId);
  });
}

/** The technician's refrigerant-handling certification number (kept on the user's profile). */
export async function certNumberOf(em: EntityManager, companyId: string, userId: string): Promise<string | null> {
  const rows = await em.execute<{ refrigerant_cert_number: string | null }[]>(
    `select "refrigerant_cert_number" from "app_user" where "id" = ? and "company_id" = ?`,
    [userId, companyId],
  );
  return rows[0]?.refrigerant_cert_number ?? null;
}

export async function setCertNumber({ em, actor }: ServiceContext, certNumber: string): Promise<string | null> {
  await em.execute(`update "app_user" set "refrigerant_cert_number" = ? where "id" = ? and "company_id" = ?`, [
    certNumber === '' ? null : certNumber,
    actor.userId,
    actor.companyId,
  ]);
  return certNumberOf(em, actor.companyId, actor.userId);
}

interface CatalogFacts {
  testPressurePsig: number | null;
  prechargedLengthFt: number | null;
  prechargeBasis: 'per-circuit' | 'system-total';
  chargeAdders: { liquidOdIn: number; ozPerFt: number }[];
  refrigerant: string | null;
}

async function catalogFacts(em: EntityManager, companyId: string, keys: string[]): Promise<Map<string, CatalogFacts>> {
  if (keys.length === 0) return new Map();
  const rows = await em.execute<{ key: string; data: Record<string, unknown> }[]>(
    `select "key", "data" from "company_data_row" where "company_id" = ? and "dataset" = 'models' and "key" in (${keys.map(() => '?').join(', ')})`,
    [companyId, ...keys],
  );
  return new Map(
    rows.map((r) => {
      const d = r.data as {
        testPressurePsig?: number;
        prechargedLengthFt?: number;
        prechargeBasis?: 'per-circuit' | 'system-total';
        chargeAdders?: { liquidOdIn: number; ozPerFt: number }[];
        refrigerant?: string;
      };
      return [
        r.key,
        {
          testPressurePsig: d.testPressurePsig ?? null,
          prechargedLengthFt: d.prechargedLengthFt ?? null,
          prechargeBasis: d.prechargeBasis ?? 'per-circuit',
          chargeAdders: d.chargeAdders ?? [],
          refrigerant: d.refrigerant ?? null,
        },
      ];
    }),
  );
}

const odOfLabel = (label: string): number | null =>
  ASTM_B280_ANNEALED.find((t) => tubeLabel({ odIn: t.odIn }) === label.replace(/\s*in$/, '').trim())?.odIn ?? null;

interface Sold {
  option: SnapshotOption | null;
  catalog: Map<string, CatalogFacts>;
  testLimit: number | null;
}

async function soldOf(em: EntityManager, companyId: string, jobId: string): Promise<Sold> {
  const sold = await soldOptionOf(em, companyId, jobId);
  if (!sold) return { option: null, catalog: new Map(), testLimit: null };
  const catalog = await catalogFacts(
    em,
    companyId,
    sold.option.systems.map((s) => s.outdoor.key),
  );
  const limits = sold.option.systems
    .map((s) => catalog.get(s.outdoor.key)?.testPressurePsig ?? null)
    .filter((v): v is number => v !== null);
  return { option: sold.option, catalog, testLimit: limits.length > 0 ? Math.min(...limits) : null };
}

async function recordRow(em: EntityManager, companyId: string, jobId: string, lock = false): Promise<RecordRow | null> {
  const rows = await em.execute<RecordRow[]>(
    `select * from "commissioning_record" where "company_id" = ? and "job_id" = ?${lock ? ' for update' : ''}`,
    [companyId, jobId],
  );
  return rows[0] ?? null;
}

/** The record row, made empty (version 1) on first need; locked when asked. */
async function ensureRecord(ctx: ServiceContext, jobId: string, lock: boolean): Promise<RecordRow> {
  const { em, actor, clock } = ctx;
  const found = await recordRow(em, actor.companyId, jobId, lock);
  if (found) return found;
  const now = clock.now();
  await em.execute(
    `insert into "commissioning_record" ("id", "company_id", "job_id", "pressure_test", "leaks", "evacuation",
       "measured_lines", "startup", "created_at", "updated_at")
     values (?, ?, ?, ?::jsonb, '[]'::jsonb, ?::jsonb, '[]'::jsonb, '[]'::jsonb, ?, ?)
     on conflict ("job_id") do nothing`,
    [randomUUID(), actor.companyId, jobId, JSON.stringify(EMPTY_PRESSURE), JSON.stringify(EMPTY_EVACUATION), now, now],
  );
  const made = await recordRow(em, actor.companyId, jobId, lock);
  if (!made) throw new ConflictError('The record could not be opened; try again.');
  return made;
}

interface EntryRow {
  id: string;
  system_key: string;
  refrigerant: string;
  added_oz: string;
  recovered_oz: string;
  lot: string | null;
  additives: string | null;
  entered_at: Date | string;
  technician_name: string;
}

async function entriesOf(em: EntityManager, companyId: string, recordId: string): Promise<EntryRow[]> {
  return em.execute<EntryRow[]>(
    `select e.*, u."name" as technician_name from "refrigerant_entry" e join "app_user" u on u."id" = e."technician_user_id"
      where e."company_id" = ? and e."record_id" = ? order by e."entered_at", e."id"`,
    [companyId, recordId],
  );
}

function pressureVerdict(p: PressureTestInput) {
  if (
    p.startPsig === null ||
    p.startF === null ||
    p.endPsig === null ||
    p.endF === null ||
    p.gaugeResolutionPsi === null
  )
    return null;
  const r = standingTestReading({
    startPsig: p.startPsig,
    startF: p.startF,
    endPsig: p.endPsig,
    endF: p.endF,
    resolutionPsi: p.gaugeResolutionPsi,
  });
  return { pass: r.pass, outcome: r.outcome, words: r.words, text: r.text };
}

function evacuationVerdictOf(e: EvacuationInput, policy: EvacuationPolicyRecord) {
  if (e.reachedMicrons === null || e.afterHoldMicrons === null || e.holdMinutes === null) return null;
  const r = evacuationReading({
    reachedMicrons: e.reachedMicrons,
    afterHoldMicrons: e.afterHoldMicrons,
    holdMinutes: e.holdMinutes,
    holdReadings: e.holdReadings,
    policy,
  });
  return { pass: r.pass, outcome: r.outcome, words: r.words };
}

function adderOf(facts: CatalogFacts | undefined, refrigerant: string, liquid: string): number | null {
  const od = odOfLabel(liquid);
  if (!facts || od === null) return null;
  const maker = facts.chargeAdders.find((a) => a.liquidOdIn === od)?.ozPerFt;
  if (maker !== undefined) return maker;
  return refrigerant in LIQUID_DENSITY_100F_LB_FT3
    ? liquidLineChargeOzPerFt({
        odIn: od,
        liquidDensityLbPerFt3: LIQUID_DENSITY_100F_LB_FT3[refrigerant as Refrigerant],
      })
    : null;
}

function systemsOf(sold: Sold, measured: CommissioningRecord['measuredLines'], entries: EntryRow[]) {
  if (!sold.option) return [];
  return sold.option.systems.map((s) => {
    const facts = sold.catalog.get(s.outdoor.key);
    const weighedInOz =
      Math.round(
        entries
          .filter((e) => e.system_key === s.key)
          .reduce((sum, e) => sum + Number(e.added_oz) - Number(e.recovered_oz), 0) * 100,
      ) / 100;
    const circuits = s.lineSets.map((l) => ({
      zoneKey: l.zoneKey,
      zoneName: l.zoneName,
      liquid: l.liquid,
      plannedInstalledFt: l.installedLengthFt,
      plannedExtraOz: l.extraChargeOz,
      ozPerFt: adderOf(facts, s.refrigerant, l.liquid),
    }));
    const precharge =
      facts && facts.prechargedLengthFt !== null
        ? { lengthFt: facts.prechargedLengthFt, basis: facts.prechargeBasis }
        : null;
    let charge: CommissioningRecord['systems'][number]['charge'] = null;
    if (precharge && circuits.every((c) => c.ozPerFt !== null)) {
      const r = recomputedExtraCharge({
        circuits: circuits.map((c) => ({
          key: c.zoneKey,
          plannedInstalledFt: c.plannedInstalledFt,
          measuredFt: measured.find((x) => x.systemKey === s.key && x.zoneKey === c.zoneKey)?.measuredFt ?? null,
          ozPerFt: c.ozPerFt ?? 0,
        })),
        prechargedLengthFt: precharge.lengthFt,
        prechargeBasis: precharge.basis,
        weighedInOz,
      });
      charge = {
        plannedOz: r.plannedOz,
        extraOz: r.extraOz,
        weighedInOz,
        differenceOz: r.differenceOz,
        words: r.words,
      };
    }
    return {
      key: s.key,
      name: s.name,
      outdoorModel: s.outdoor.key,
      refrigerant: s.refrigerant,
      testPressurePsig: facts?.testPressurePsig ?? null,
      circuits,
      precharge,
      charge,
    };
  });
}

async function present(ctx: ServiceContext, jobId: string, row: RecordRow): Promise<CommissioningRecord> {
  const { em, actor } = ctx;
  const job = await openJob(ctx, jobId);
  // One after another: inside a transaction they share one connection.
  const sold = await soldOf(em, actor.companyId, jobId);
  const policy = await policyOf(em, actor.companyId);
  const entries = await entriesOf(em, actor.companyId, row.id);
  const cert = await certNumberOf(em, actor.companyId, actor.userId);
  const amendments = await em.execute<
    { id: string; what: string; correction: string; reason: string; by_name: string; at: Date | string }[]
  >(`select * from "commissioning_amendment" where "company_id" = ? and "record_id" = ? order by "at", "id"`, [
    actor.companyId,
    row.id,
  ]);
  const pv = pressureVerdict(row.pressure_test);
  const ev = evacuationVerdictOf(row.evacuation, policy);
  const systems = systemsOf(sold, row.measured_lines, entries);
  const missing: string[] = [];
  if (!sold.option) missing.push('The job has no signed proposal: there is nothing sold to commission.');
  if (job.status !== 'won' && row.installed_at === null) missing.push('The job must be won before it is signed off.');
  if (row.pressure_test.testGas === null || row.pressure_test.testPsig === null)
    missing.push('Pressure test: the gas and the test pressure.');
  if (!pv) missing.push('Pressure test: start and end readings, their temperatures and the gauge division.');
  else if (!pv.pass) missing.push('Pressure test: it did not hold — repair and test again.');
  if (!ev) missing.push('Evacuation: the lowest reading, the reading after the hold and the hold minutes.');
  else if (!ev.pass) missing.push('Evacuation: it did not pass the company’s policy.');
  if (!cert) missing.push('Your refrigerant-handling certification number (on your profile).');
  const a2l =
    sold.option?.systems.some(
      (s) => s.refrigerant in REFRIGERANT_INFO && isA2l({ refrigerant: s.refrigerant as Refrigerant }),
    ) ?? false;
  return {
    jobId,
    version: row.version,
    state: row.installed_at === null ? 'open' : 'installed',
    jobStatus: job.status,
    pressureTest: row.pressure_test,
    leaks: row.leaks,
    evacuation: row.evacuation,
    measuredLines: row.measured_lines,
    startup: row.startup,
    notes: row.notes,
    systems,
    testPressureLimitPsig: sold.testLimit,
    verdicts: { pressureTest: pv, evacuation: ev },
    policy,
    refrigerant: entries.map((e) => ({
      id: e.id,
      systemKey: e.system_key,
      refrigerant: e.refrigerant,
      addedOz: Number(e.added_oz),
      recoveredOz: Number(e.recovered_oz),
      lot: e.lot,
      additives: e.additives,
      technicianName: e.technician_name,
      enteredAt: iso(e.entered_at),
    })),
    technicianCertNumber: cert,
    missing: row.installed_at === null ? missing : [],
    signOff:
      row.installed_at === null
        ? null
        : {
            installerName: row.signed_off_by_name ?? '',
            certNumber: row.cert_number ?? '',
            customerName: row.customer_name ?? '',
            signedAt: iso(row.installed_at),
          },
    amendments: amendments.map((a) => ({
      id: a.id,
      what: a.what,
      correction: a.correction,
      reason: a.reason,
      by: a.by_name,
      at: iso(a.at),
    })),
    cautions: [...COMMISSIONING_CAUTIONS, ...(a2l ? [A2L_CAUTION] : []), ADDITIVE_CAUTION],
  };
}

/** The record of a job (made empty on the first read). */
export async function readRecord(ctx: ServiceContext, jobId: string): Promise<CommissioningRecord> {
  await openJob(ctx, jobId);
  const row = await ensureRecord(ctx, jobId, false);
  return present(ctx, jobId, row);
}

const readOnly = () =>
  new ConflictError('The record is signed off and read-only: add an amendment with what is corrected and why.', {
    reason: 'read-only',
  });

/** Test pressure and readings against the equipment's test pressure: refused beside the field with the reason. */
function checkAgainstLimit(p: PressureTestInput, limit: number | null, models: string): void {
  if (limit === null) return;
  const errors: { path: string; message: string }[] = [];
  const over = (v: number | null) => v !== null && v > limit;
  const why = `${limit} psig is the test pressure the catalog gives for ${models}; going above it can damage the coil, valves or joints. Never exceed the nameplate or manual value.`;
  if (over(p.testPsig))
    errors.push({ path: 'pressureTest.testPsig', message: `Above the equipment’s test pressure: ${why}` });
  if (over(p.startPsig))
    errors.push({ path: 'pressureTest.startPsig', message: `Above the equipment’s test pressure: ${why}` });
  if (errors.length > 0) throw new ValidationError(errors, 'The test pressure is above what the equipment allows.');
}

/** One step as entered (If-Match: the record's version; a stale one is a 409 with the record as it is now). */
export async function patchRecord(
  ctx: ServiceContext,
  jobId: string,
  version: number,
  patch: CommissioningPatch,
): Promise<CommissioningRecord> {
  await openJob(ctx, jobId);
  const sold = await soldOf(ctx.em, ctx.actor.companyId, jobId);
  if (patch.pressureTest)
    checkAgainstLimit(
      patch.pressureTest,
      sold.testLimit,
      sold.option?.systems.map((s) => s.outdoor.key).join(', ') ?? 'this equipment',
    );
  if (patch.measuredLines && sold.option) {
    const known = new Set(sold.option.systems.flatMap((s) => s.lineSets.map((l) => `${s.key}\u0000${l.zoneKey}`)));
    const bad = patch.measuredLines.findIndex((m) => !known.has(`${m.systemKey}\u0000${m.zoneKey}`));
    if (bad >= 0)
      throw new ValidationError([{ path: `measuredLines.${bad}`, message: 'That circuit is not in what was sold.' }]);
  }
  return ctx.em.transactional(async (tx) => {
    const inner = { ...ctx, em: tx };
    const row = await ensureRecord(inner, jobId, true);
    if (row.installed_at !== null) throw readOnly();
    assertVersion(version, row.version, 'The commissioning record', () => null);
    const sets: string[] = [];
    const values: unknown[] = [];
    const json = (col: string, v: unknown) => {
      sets.push(`"${col}" = ?::jsonb`);
      values.push(JSON.stringify(v));
    };
    if (patch.pressureTest) json('pressure_test', patch.pressureTest);
    if (patch.leaks) json('leaks', patch.leaks);
    if (patch.evacuation) json('evacuation', patch.evacuation);
    if (patch.measuredLines) json('measured_lines', patch.measuredLines);
    if (patch.startup) json('startup', patch.startup);
    if (patch.notes !== undefined) {
      sets.push('"notes" = ?');
      values.push(patch.notes);
    }
    await tx.execute(
      `update "commissioning_record" set ${[...sets, '"version" = "version" + 1', '"updated_at" = ?', '"changed_by_id" = ?', '"changed_by_name" = ?', '"changed_on_device" = ?'].join(', ')}
        where "id" = ?`,
      [...values, ctx.clock.now(), ctx.actor.userId, ctx.actor.name, ctx.actor.device ?? null, row.id],
    );
    const after = await recordRow(tx, ctx.actor.companyId, jobId);
    return present(inner, jobId, after!);
  });
}

/**
 * A stale If-Match answers with both sides: `current` is the record as it is now (theirs); the client
 * holds its own edit (yours). Wraps patchRecord's 409 so `current` is the whole presented record.
 */
export async function patchOrConflict(
  ctx: ServiceContext,
  jobId: string,
  version: number,
  patch: CommissioningPatch,
): Promise<CommissioningRecord> {
  try {
    return await patchRecord(ctx, jobId, version, patch);
  } catch (e) {
    if (e instanceof ConflictError && (e.extra as { currentVersion?: number }).currentVersion !== undefined) {
      const current = await readRecord(ctx, jobId);
      throw new ConflictError(e.message, { currentVersion: current.version, current, yours: patch });
    }
    throw e;
  }
}

/** One weighing of refrigerant (insert-only; the same id again answers the record unchanged). */
export async function addRefrigerant(
  ctx: ServiceContext,
  jobId: string,
  input: RefrigerantEntryInput,
): Promise<CommissioningRecord> {
  await openJob(ctx, jobId);
  const sold = await soldOf(ctx.em, ctx.actor.companyId, jobId);
  const system = sold.option?.systems.find((s) => s.key === input.systemKey);
  if (!system) throw new ValidationError([{ path: 'systemKey', message: 'That system is not in what was sold.' }]);
  const norm = (r: string) =>
    r
      .toUpperCase()
      .replace(/\s+/g, '')
      .replace(/^R(?!-)/, 'R-');
  if (norm(input.refrigerant) !== norm(system.refrigerant))
    throw new ValidationError([
      {
        path: 'refrigerant',
        message: `This system takes ${system.refrigerant}. Never mix refrigerants: charge only the type on the outdoor unit’s nameplate.`,
      },
    ]);
  return ctx.em.transactional(async (tx) => {
    const inner = { ...ctx, em: tx };
    const row = await ensureRecord(inner, jobId, true);
    if (row.installed_at !== null) throw readOnly();
    const dup = await tx.execute<{ id: string; company_id: string; record_id: string }[]>(
      `select "id", "company_id", "record_id" from "refrigerant_entry" where "id" = ?`,
      [input.id],
    );
    if (dup[0]) {
      if (dup[0].company_id !== ctx.actor.companyId || dup[0].record_id !== row.id)
        throw new ConflictError('That entry id is already used.');
      return present(inner, jobId, row);
    }
    await tx.execute(
      `insert into "refrigerant_entry" ("id", "company_id", "job_id", "record_id", "system_key", "refrigerant", "added_oz",
         "recovered_oz", "technician_user_id", "entered_at", "lot", "additives")
       values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
      [
        input.id,
        ctx.actor.companyId,
        jobId,
        row.id,
        system.key,
        system.refrigerant,
        input.addedOz,
        input.recoveredOz,
        ctx.actor.userId,
        ctx.clock.now(),
        input.lot || null,
        input.additives || null,
      ],
    );
    return present(inner, jobId, row);
  });
}

/**
 * The installer's sign-off and the customer's acknowledgement, then the job → installed and the record
 * read-only. Refused (409, the list of what is missing) until every step passes and the technician's
 * certification number is on their profile; the job must be won.
 */
export async function signOff(
  ctx: ServiceContext & { storage: Storage },
  jobId: string,
  version: number,
  body: { customerName: string; signature: string },
): Promise<CommissioningRecord> {
  await openJob(ctx, jobId);
  const image = await checkSignatureImage(body.signature);
  const key = `commissioning-ack-${randomUUID()}`;
  return ctx.em.transactional(async (tx) => {
    const inner = { ...ctx, em: tx };
    await tx.execute('select id from "job" where id = ? and company_id = ? for update', [jobId, ctx.actor.companyId]);
    const row = await ensureRecord(inner, jobId, true);
    if (row.installed_at !== null) throw readOnly();
    assertVersion(version, row.version, 'The commissioning record', () => null);
    const now = await present(inner, jobId, row);
    if (now.missing.length > 0)
      throw new ConflictError(`Not ready to sign off: ${now.missing.join(' ')}`, {
        reason: 'incomplete',
        missing: now.missing,
      });
    const cert = now.technicianCertNumber!;
    await ctx.storage.put(key, image.png, 'image/png');
    const at = ctx.clock.now();
    await tx.execute(
      `update "commissioning_record" set "signed_off_by_id" = ?, "signed_off_by_name" = ?, "cert_number" = ?,
         "customer_name" = ?, "customer_signature_key" = ?, "installed_at" = ?, "version" = "version" + 1,
         "updated_at" = ?, "changed_by_id" = ?, "changed_by_name" = ?, "changed_on_device" = ?
       where "id" = ?`,
      [
        ctx.actor.userId,
        ctx.actor.name,
        cert,
        body.customerName,
        key,
        at,
        at,
        ctx.actor.userId,
        ctx.actor.name,
        ctx.actor.device ?? null,
        row.id,
      ],
    );
    // The job's move won → installed (the status machine's), as the system makes it on sign-off.
    await tx.execute(
      `update "job" set "status" = 'installed', "version" = "version" + 1, "last_activity_at" = ?,
         "changed_by_id" = ?, "changed_by_name" = ?, "changed_on_device" = ?
       where "id" = ? and "company_id" = ? and "status" = 'won'`,
      [at, ctx.actor.userId, ctx.actor.name, ctx.actor.device ?? null, jobId, ctx.actor.companyId],
    );
    const after = await recordRow(tx, ctx.actor.companyId, jobId);
    return present(inner, jobId, after!);
  });
}

/** A correction to a signed-off record: who, when, what and why (insert-only; the record itself stays). */
export async function addAmendment(
  ctx: ServiceContext,
  jobId: string,
  input: { what: string; correction: string; reason: string },
): Promise<CommissioningRecord> {
  await openJob(ctx, jobId);
  const row = await recordRow(ctx.em, ctx.actor.companyId, jobId);
  if (!row || row.installed_at === null)
    throw new ConflictError('Only a signed-off record takes amendments; until then change the step itself.', {
      reason: 'not-signed-off',
    });
  await ctx.em.execute(
    `insert into "commissioning_amendment" ("id", "company_id", "record_id", "by_user_id", "by_name", "what", "correction", "reason", "at")
     values (?, ?, ?, ?, ?, ?, ?, ?, ?)`,
    [
      randomUUID(),
      ctx.actor.companyId,
      row.id,
      ctx.actor.userId,
      ctx.actor.name,
      input.what,
      input.correction,
      input.reason,
      ctx.clock.now(),
    ],
  );
  return present(ctx, jobId, row);
}
