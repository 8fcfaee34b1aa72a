import { explanation, input, type Explanation } from '../explain/explanation';
import { formatNumber, formatQuantity } from '../explain/format';
import { roundHalfUp } from '../rounding';
import type { Circuit } from '../schemas/design';
import type { IndoorUnit, OutdoorUnit } from '../schemas/equipment';
import { TAKEOFF_DEFAULTS } from '../takeoff/defaults';
import { gFromOz } from '../units';
import { A2L_INSTALL_HEIGHT_M, REFRIGERANT_INFO, a2lM1Kg, a2lMinRoomAreaM2, isA2l } from './a2l';
import { CAUTIONS } from './cautions';
import { LIQUID_DENSITY_100F_LB_FT3, liquidLineChargeOzPerFt } from './charge';
import { tubeLabel } from './tube';

/** The space a leak from one indoor unit spreads over, for the A2L room-size check. */
export interface A2lSpace {
  /** 'head-room': the room a ductless head is installed in; 'open-space': the zone's rooms as one open space; 'served-rooms': every room a ducted unit's ducts serve. */
  readonly basis: 'head-room' | 'open-space' | 'served-rooms';
  readonly roomNames: readonly string[];
  /** Release height h0, m (a ducted unit's lowest duct opening); absent → the unit type's reference height. */
  readonly h0M?: number;
}

/** A circuit to plan: the line set and the indoor unit (and the floor area a leak from it spreads over, m²). */
export interface CircuitToPlan {
  readonly circuit: Circuit;
  readonly indoor: IndoorUnit;
  readonly roomAreaM2: number;
  /** What roomAreaM2 is (absent → the room holding the indoor unit). */
  readonly space?: A2lSpace;
  /** The zone's name, for the words (else its key). */
  readonly zoneName?: string;
}

export interface CircuitCharge {
  readonly zoneKey: string;
  readonly liquidOdIn: number;
  readonly suctionOdIn: number;
  readonly liquidLabel: string;
  readonly suctionLabel: string;
  /** The run, ft. */
  readonly lengthFt: number;
  /** The length installed, ft: the kit's length for a pre-flared kit (its surplus coiled), else the run. */
  readonly installedLengthFt: number;
  readonly lineSet: 'kit' | 'field-cut';
  readonly kitLengthFt: number | null;
  readonly coiledFt: number;
  readonly liftFt: number;
  readonly liftDirection: 'indoor-above' | 'indoor-below';
  /** Length charged beyond the pre-charge, ft (this circuit's share for a system-total pre-charge). */
  readonly chargedLengthFt: number;
  readonly adderOzPerFt: number;
  /** 'equipment' = maker's adder for this liquid size; 'estimate' = liquid-full tube volume at 100 °F. */
  readonly adderSource: 'equipment' | 'estimate';
  readonly extraChargeOz: number;
  readonly warnings: readonly string[];
  /** Limits this circuit exceeds (the design cannot be marked ready). */
  readonly blockers: readonly string[];
  readonly explanation: Explanation;
}

export interface RefrigerantPlan {
  readonly refrigerant: OutdoorUnit['refrigerant'];
  readonly safetyClass: string;
  readonly circuits: readonly CircuitCharge[];
  /** Sum of the runs, ft. */
  readonly totalLengthFt: number;
  /** Sum of the installed lengths, ft (kits' coiled surplus included). */
  readonly totalInstalledLengthFt: number;
  /** Largest height between two indoor units of this system, ft (0 with one). */
  readonly indoorHeightDifferenceFt: number;
  readonly extraChargeOz: number;
  readonly factoryChargeOz: number;
  readonly totalChargeOz: number;
  readonly warnings: readonly string[];
  readonly blockers: readonly string[];
  /** The blockers that are A2L room-size checks (a subset of `blockers`). */
  readonly a2lBlockers: readonly string[];
  readonly notes: readonly string[];
  readonly cautions: readonly string[];
  /** Extra charge in total, total system charge, A2L check: each with its formula. */
  readonly explanations: readonly Explanation[];
  readonly isEstimate: true;
}

/** Shortest stock kit at least as long as the run, ft; null when none is. [TRADE: stock kit lengths] */
function stockKit(lengthFt: number): number | null {
  for (const k of TAKEOFF_DEFAULTS.lineSetKitLengthsFt) if (k >= lengthFt) return k;
  return null;
}

/** The installed length of a circuit: the kit's length for a pre-flared kit, else the run. */
export function installedLength(c: Circuit): {
  lineSet: 'kit' | 'field-cut';
  kitLengthFt: number | null;
  installedFt: number;
} {
  if (c.lineSet === 'field-cut') return { lineSet: 'field-cut', kitLengthFt: null, installedFt: c.lengthFt };
  const kit = c.kitLengthFt !== undefined && c.kitLengthFt >= c.lengthFt ? c.kitLengthFt : stockKit(c.lengthFt);
  if (kit === null) return { lineSet: 'field-cut', kitLengthFt: null, installedFt: c.lengthFt };
  return { lineSet: 'kit', kitLengthFt: kit, installedFt: kit };
}

/**
 * The maker's adder for a liquid-line size, oz/ft: the per-size adder when the data lists that size,
 * else the single adder when it is for that size (or names none); null → no maker figure for this size.
 */
export function adderForLiquid(outdoor: OutdoorUnit, liquidOdIn: number): number | null {
  const listed = outdoor.chargeAdders?.find((a) => a.liquidOdIn === liquidOdIn);
  if (listed) return listed.ozPerFt;
  if (outdoor.adderOzPerFt === undefined) return null;
  if (outdoor.liquidOdIn !== undefined && outdoor.liquidOdIn !== liquidOdIn) return null;
  if (outdoor.chargeAdders !== undefined && outdoor.chargeAdders.length > 0) return null;
  return outdoor.adderOzPerFt;
}

const ft = (v: number) => formatQuantity(v, 'ft', 1);
const oz = (v: number) => formatQuantity(v, 'oz', 1);
const rate = (v: number) => `${formatNumber(v, 3, { trim: true })} oz/ft`;

const UNIT_WORDS: Record<IndoorUnit['unitType'], string> = {
  'wall-head': 'wall head',
  'ceiling-cassette': 'ceiling cassette',
  'floor-console': 'floor console',
  'slim-ducted': 'slim ducted unit',
  'ducted-air-handler': 'ducted unit',
};

const SPACE_WORDS: Record<A2lSpace['basis'], string> = {
  'head-room': 'the room the indoor unit is in',
  'open-space': "the zone's rooms, one open space",
  'served-rooms': 'the rooms its ducts serve',
};

/**
 * One indoor unit's A2L check against the whole system charge (every circuit is joined at the outdoor
 * unit, so the system's charge can leak out at any indoor unit). Without factory detection:
 * A_min = (M / (2.5 × LFL^1.25 × h0))², h0 ≥ 0.6 m [PUB: IEC 60335-2-40:2018 Annex GG, reference §11],
 * against the space a leak spreads over (see A2lSpace). With the maker's refrigerant detection and
 * mitigation the room-area limit gives way to the ceiling m2 = 52 m³ × LFL [MEM: the reference marks
 * the multiplier "from memory"], and the mitigation must be installed as the maker instructs.
 */
function a2lCircuitCheck({
  circuit,
  indoor,
  roomAreaM2,
  space,
  zoneName,
  chargeKg,
  lflKgPerM3,
  keyPrefix,
}: CircuitToPlan & { readonly chargeKg: number; readonly lflKgPerM3: number; readonly keyPrefix: string }): {
  blocker: string | null;
  note: string | null;
  explanation: Explanation;
} {
  const kg = (v: number) => formatQuantity(v, 'kg', 2);
  const name = zoneName ?? circuit.zoneKey;
  const basis = space?.basis ?? 'head-room';
  const rooms = space && space.roomNames.length > 0 ? ` (${space.roomNames.join(', ')})` : '';
  const where = `${SPACE_WORDS[basis]}${rooms}`;
  const key = `${keyPrefix}a2l:${circuit.zoneKey}`;
  const label = `A2L room size, ${name}`;
  const source = 'IEC 60335-2-40:2018 Annex GG (estimate; confirm the edition adopted locally)';
  if (indoor.refrigerantDetection === true) {
    const m2 = 52 * lflKgPerM3;
    const ok = chargeKg <= m2;
    const msg = `The ${name} indoor unit has the maker's refrigerant detection, but the system charge (${kg(chargeKg)}) is above the ${kg(m2)} ceiling (52 m³ × LFL) for any room: split the system or check the maker's rules.`;
    return {
      blocker: ok ? null : msg,
      note: "An indoor unit with the maker's refrigerant detection relies on its mitigation (sensor, circulation airflow, shut-off): install and wire it as the maker instructs and test it at start-up.",
      explanation: explanation({
        key,
        label,
        value: roundHalfUp(chargeKg, 2),
        unit: 'kg',
        valueText: kg(chargeKg),
        text: `Factory refrigerant detection: ${kg(chargeKg)} system charge ≤ m2 = 52 m³ × ${formatNumber(lflKgPerM3, 3)} kg/m³ = ${kg(m2)} (the room-area limit is replaced by the mitigation); ${where} ${formatQuantity(roomAreaM2, 'm²', 1)}`,
        verdict: ok
          ? 'Within the ceiling for a unit with refrigerant detection: the mitigation must be installed as the maker instructs.'
          : msg,
        status: ok ? 'ok' : 'blocker',
        source: `${source}; the m2 multiplier is from memory`,
      }),
    };
  }
  const h0 = Math.max(0.6, space?.h0M ?? A2L_INSTALL_HEIGHT_M[indoor.unitType]);
  const minArea = a2lMinRoomAreaM2({ chargeKg, lflKgPerM3, h0M: h0 });
  const ok = roomAreaM2 >= minArea;
  const h0Words =
    basis === 'served-rooms'
      ? space?.h0M === undefined
        ? 'h0 0.6 m (the lowest duct opening is not given, so the least the standard allows)'
        : `h0 ${formatQuantity(h0, 'm', 2)} (the lowest duct opening)`
      : `h0 ${formatQuantity(h0, 'm', 1)} (${UNIT_WORDS[indoor.unitType]} reference height)`;
  const msg = `The space a leak from the ${name} indoor unit spreads over, ${where}, is ${formatQuantity(roomAreaM2, 'm²', 1)}: smaller than the estimated minimum ${formatQuantity(minArea, 'm²', 1)} for this system's ${kg(chargeKg)}. Choose a unit with the maker's refrigerant detection, a smaller system, or check the maker's room-size rules.`;
  return {
    blocker: ok ? null : msg,
    note: null,
    explanation: explanation({
      key,
      label,
      value: roundHalfUp(minArea, 1),
      unit: 'm²',
      valueText: formatQuantity(minArea, 'm²', 1),
      text: `A_min = (${kg(chargeKg)} system charge ÷ (2.5 × ${formatNumber(lflKgPerM3, 3)}^1.25 × ${formatQuantity(h0, 'm', 2)}))² = ${formatQuantity(minArea, 'm²', 1)}; ${h0Words}; ${where}: ${formatQuantity(roomAreaM2, 'm²', 1)}`,
      verdict: ok ? `Large enough for this charge: ${where}.` : msg,
      status: ok ? 'ok' : 'blocker',
      source,
    }),
  };
}

/**
 * Refrigerant plan for one outdoor unit. Per circuit: the installed length (a pre-flared kit's
 * coiled surplus counts, it holds refrigerant too), the maker's adder for that circuit's liquid size
 * (else a labelled tube-volume estimate), the extra charge beyond the pre-charged length
 * [reference §8: max(0, L − L_pre) × adder, never negative]. A 'system-total' pre-charge is
 * subtracted once from the sum of the installed lengths and the remainder shared by the circuits in
 * proportion to their installed length, each at its own adder [OWN: the allocation; issue 9's
 * correction]. Limits: run length (min/max), total length, lift, height between indoor units; A2L
 * room-area check [IEC 60335-2-40:2018 Annex GG]. Charges in oz, rounded half-up to 0.1 oz per
 * circuit; the system extra is the sum of the rounded circuits.
 */
export function refrigerantPlan({
  outdoor,
  circuits,
  keyPrefix = '',
}: {
  readonly outdoor: OutdoorUnit;
  readonly circuits: readonly CircuitToPlan[];
  /** Prefix of the explanations' keys ("sys-1:"), so two systems of one design stay apart. */
  readonly keyPrefix?: string;
}): RefrigerantPlan {
  let totalLength = 0;
  let totalInstalled = 0;
  const installed = circuits.map(({ circuit }) => {
    const i = installedLength(circuit);
    totalLength += circuit.lengthFt;
    totalInstalled += i.installedFt;
    return i;
  });
  const warnings: string[] = [];
  const blockers: string[] = [];
  const systemBasis = outdoor.prechargeBasis === 'system-total';
  const systemBeyond = systemBasis ? Math.max(0, totalInstalled - outdoor.prechargedLengthFt) : 0;
  let anyEstimate = false;
  const planned = circuits.map(({ circuit, indoor, zoneName }, idx): CircuitCharge => {
    const name = zoneName ?? circuit.zoneKey;
    const inst = installed[idx] ?? { lineSet: 'field-cut' as const, kitLengthFt: null, installedFt: circuit.lengthFt };
    const liquidOdIn = circuit.liquidOdIn ?? indoor.liquidOdIn;
    const suctionOdIn = circuit.suctionOdIn ?? indoor.suctionOdIn;
    const maker = adderForLiquid(outdoor, liquidOdIn);
    const adder =
      maker ??
      liquidLineChargeOzPerFt({
        odIn: liquidOdIn,
        liquidDensityLbPerFt3: LIQUID_DENSITY_100F_LB_FT3[outdoor.refrigerant],
      });
    if (maker === null) anyEstimate = true;
    const charged = systemBasis
      ? totalInstalled > 0
        ? systemBeyond * (inst.installedFt / totalInstalled)
        : 0
      : Math.max(0, inst.installedFt - outdoor.prechargedLengthFt);
    const extra = roundHalfUp(charged * adder, 1);
    const coiled = inst.installedFt - circuit.lengthFt;
    const w: string[] = [];
    const b: string[] = [];
    if (circuit.lengthFt > outdoor.maxLineLengthFt)
      b.push(
        `Line set for ${name} is ${ft(circuit.lengthFt)}; the maker allows at most ${ft(outdoor.maxLineLengthFt)}.`,
      );
    if (inst.installedFt < outdoor.minLineLengthFt)
      b.push(
        `Line set for ${name} is ${ft(inst.installedFt)}; the maker asks for at least ${ft(outdoor.minLineLengthFt)}.`,
      );
    if (circuit.liftFt > outdoor.maxLiftFt)
      b.push(`Lift for ${name} is ${ft(circuit.liftFt)}; the maker allows at most ${ft(outdoor.maxLiftFt)}.`);
    if (circuit.liftFt > circuit.lengthFt) b.push(`Lift for ${name} is more than its line-set length: check both.`);
    if (liquidOdIn !== indoor.liquidOdIn)
      w.push(
        `Liquid line for ${name} (${tubeLabel({ odIn: liquidOdIn })} in) differs from the indoor unit's connection (${tubeLabel({ odIn: indoor.liquidOdIn })} in): use reducers and the maker's charge rule for that size.`,
      );
    const runText =
      inst.lineSet === 'kit' && coiled > 0
        ? `${ft(inst.installedFt)} installed (${ft(circuit.lengthFt)} run + ${ft(coiled)} of the ${ft(inst.installedFt)} kit coiled)`
        : `${ft(inst.installedFt)} installed`;
    const adderText = `${rate(adder)}${maker === null ? ' (estimate: liquid-full line at 100 °F)' : ''}`;
    const text = systemBasis
      ? `${runText}; system: ${ft(totalInstalled)} installed − ${ft(outdoor.prechargedLengthFt)} pre-charged = ${ft(systemBeyond)}, this circuit's share ${ft(inst.installedFt)} ÷ ${ft(totalInstalled)} = ${ft(roundHalfUp(charged, 1))} × ${adderText} = ${oz(extra)}`
      : inst.installedFt <= outdoor.prechargedLengthFt
        ? `${runText} ≤ ${ft(outdoor.prechargedLengthFt)} pre-charged: nothing to add (no charge is removed for a short run) = ${oz(0)}`
        : `${runText} − ${ft(outdoor.prechargedLengthFt)} pre-charged = ${ft(roundHalfUp(charged, 1))} × ${adderText} = ${oz(extra)}`;
    return {
      zoneKey: circuit.zoneKey,
      liquidOdIn,
      suctionOdIn,
      liquidLabel: tubeLabel({ odIn: liquidOdIn }),
      suctionLabel: tubeLabel({ odIn: suctionOdIn }),
      lengthFt: circuit.lengthFt,
      installedLengthFt: inst.installedFt,
      lineSet: inst.lineSet,
      kitLengthFt: inst.kitLengthFt,
      coiledFt: coiled,
      liftFt: circuit.liftFt,
      liftDirection: circuit.liftDirection ?? 'indoor-above',
      chargedLengthFt: roundHalfUp(charged, 2),
      adderOzPerFt: roundHalfUp(adder, 3),
      adderSource: maker === null ? 'estimate' : 'equipment',
      extraChargeOz: extra,
      warnings: w,
      blockers: b,
      explanation: explanation({
        key: `${keyPrefix}charge:${circuit.zoneKey}`,
        label: `Extra charge, ${name} circuit`,
        value: extra,
        unit: 'oz',
        valueText: oz(extra),
        text,
        inputs: [
          input('Run', circuit.lengthFt, 'ft', ft(circuit.lengthFt)),
          input('Installed', inst.installedFt, 'ft', ft(inst.installedFt)),
          input(
            systemBasis ? 'System pre-charged length' : 'Pre-charged length',
            outdoor.prechargedLengthFt,
            'ft',
            ft(outdoor.prechargedLengthFt),
          ),
          input('Adder', adder, 'oz/ft', rate(adder)),
        ],
        verdict:
          inst.lineSet === 'kit' && coiled > 0
            ? `The kit's ${ft(coiled)} surplus is coiled, not cut: it holds refrigerant, so it is charged.`
            : undefined,
        status: maker === null ? 'note' : 'ok',
        source:
          maker === null
            ? 'Estimate from ASTM B280 tube volume and the liquid density at 100 °F; use the maker’s adder when you have it'
            : "The maker's pre-charged length and adder for this liquid size",
      }),
    };
  });
  if (outdoor.maxTotalLineLengthFt !== undefined && totalInstalled > outdoor.maxTotalLineLengthFt)
    blockers.push(
      `Total line-set length is ${ft(totalInstalled)}; the maker allows at most ${ft(outdoor.maxTotalLineLengthFt)} for this outdoor unit.`,
    );
  let lo = Infinity;
  let hi = -Infinity;
  for (const c of planned) {
    const h = c.liftDirection === 'indoor-below' ? -c.liftFt : c.liftFt;
    if (h < lo) lo = h;
    if (h > hi) hi = h;
  }
  const heightDiff = planned.length > 1 ? hi - lo : 0;
  if (outdoor.maxIndoorHeightDiffFt !== undefined && heightDiff > outdoor.maxIndoorHeightDiffFt)
    blockers.push(
      `The indoor units are ${ft(heightDiff)} apart in height; the maker allows at most ${ft(outdoor.maxIndoorHeightDiffFt)} between indoor units.`,
    );
  const extra = roundHalfUp(
    planned.reduce((s, c) => s + c.extraChargeOz, 0),
    1,
  );
  const total = roundHalfUp(outdoor.factoryChargeOz + extra, 1);
  const notes: string[] = [];
  const cautions: string[] = [CAUTIONS.makerAndCode, CAUTIONS.refrigerant, CAUTIONS.pressureTest];
  if (anyEstimate)
    notes.push(
      "Estimate: the equipment data has no charge adder for this liquid size, so the extra charge assumes a liquid-full line at 100 °F. Use the maker's figure when you have it.",
    );
  const coiledKits = planned.filter((c) => c.coiledFt > 0);
  if (coiledKits.length > 0)
    notes.push(
      `Pre-flared kits longer than the run: ${coiledKits.map((c) => `${ft(c.coiledFt)} coiled on the ${c.zoneKey} circuit`).join(', ')}. Coil the surplus horizontally near the outdoor unit as the maker shows; it is counted in the charge.`,
    );
  const explanations: Explanation[] = [
    explanation({
      key: `${keyPrefix}charge:extra-total`,
      label: 'Extra charge, all circuits',
      value: extra,
      unit: 'oz',
      valueText: oz(extra),
      text:
        planned.length === 0
          ? `No circuits = ${oz(0)}`
          : `${planned.map((c) => oz(c.extraChargeOz)).join(' + ')} = ${oz(extra)}`,
      status: 'ok',
    }),
    explanation({
      key: `${keyPrefix}charge:system-total`,
      label: 'Total system charge',
      value: total,
      unit: 'oz',
      valueText: `${oz(total)} (${formatQuantity(gFromOz({ oz: total }) / 1000, 'kg', 2)})`,
      text: `${oz(outdoor.factoryChargeOz)} factory charge + ${oz(extra)} added = ${oz(total)}`,
      inputs: [
        input('Factory charge', outdoor.factoryChargeOz, 'oz', oz(outdoor.factoryChargeOz)),
        input('Added', extra, 'oz', oz(extra)),
      ],
      source: "The maker's factory charge",
    }),
  ];
  const info = REFRIGERANT_INFO[outdoor.refrigerant];
  const a2lBlockers: string[] = [];
  if (isA2l({ refrigerant: outdoor.refrigerant }) && info.lflKgPerM3 !== null) {
    cautions.push(CAUTIONS.a2l);
    const chargeKg = gFromOz({ oz: total }) / 1000;
    const m1 = a2lM1Kg({ lflKgPerM3: info.lflKgPerM3 });
    notes.push(`${outdoor.refrigerant} is an A2L refrigerant (lower flammability).`);
    const kg = (v: number) => formatQuantity(v, 'kg', 2);
    if (chargeKg > m1) {
      notes.push(
        `The total charge (${kg(chargeKg)}) is above ${kg(m1)} (6 m³ × LFL), so minimum room-area rules apply. The check uses IEC 60335-2-40:2018 Annex GG as an estimate: confirm with the maker's table and the edition of UL 60335-2-40 / ASHRAE 15.2 adopted locally.`,
      );
      circuits.forEach((c) => {
        const a = a2lCircuitCheck({ ...c, chargeKg, lflKgPerM3: info.lflKgPerM3, keyPrefix });
        if (a.blocker !== null) {
          blockers.push(a.blocker);
          a2lBlockers.push(a.blocker);
        }
        explanations.push(a.explanation);
        if (a.note !== null && !notes.includes(a.note)) notes.push(a.note);
      });
    } else {
      explanations.push(
        explanation({
          key: `${keyPrefix}a2l:m1`,
          label: 'A2L charge threshold',
          value: roundHalfUp(chargeKg, 2),
          unit: 'kg',
          valueText: kg(chargeKg),
          text: `${kg(chargeKg)} total ≤ m1 = 6 m³ × ${formatNumber(info.lflKgPerM3, 3)} kg/m³ = ${kg(m1)}`,
          verdict: 'Below m1: no minimum room area applies.',
          status: 'ok',
          source: 'IEC 60335-2-40:2018 GG.2 (estimate; confirm the edition adopted locally)',
        }),
      );
    }
  }
  const blockersAll = [...planned.flatMap((c) => c.blockers), ...blockers];
  return {
    refrigerant: outdoor.refrigerant,
    safetyClass: info.safetyClass,
    circuits: planned,
    totalLengthFt: totalLength,
    totalInstalledLengthFt: totalInstalled,
    indoorHeightDifferenceFt: heightDiff,
    extraChargeOz: extra,
    factoryChargeOz: outdoor.factoryChargeOz,
    totalChargeOz: total,
    // The blockers are listed among the warnings too (as before they had their own list), so a reader of warnings misses none.
    warnings: [...warnings, ...blockersAll, ...planned.flatMap((c) => c.warnings)],
    blockers: blockersAll,
    a2lBlockers,
    notes,
    cautions,
    explanations,
    isEstimate: true,
  };
}
