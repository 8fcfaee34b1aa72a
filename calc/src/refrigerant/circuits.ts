import { roundHalfUp } from '../rounding';
import type { Circuit } from '../schemas/design';
import type { IndoorUnit, OutdoorUnit } from '../schemas/equipment';
import { gFromOz } from '../units';
import { A2L_INSTALL_HEIGHT_M, REFRIGERANT_INFO, a2lM1Kg, a2lMinRoomAreaM2, isA2l } from './a2l';
import { CAUTIONS } from './cautions';
import { LIQUID_DENSITY_100F_LB_FT3, extraChargeOz, liquidLineChargeOzPerFt } from './charge';
import { tubeLabel } from './tube';

/** A circuit to plan: the line set and the indoor unit (and the floor area where it sits, m²). */
export interface CircuitToPlan {
  readonly circuit: Circuit;
  readonly indoor: IndoorUnit;
  readonly roomAreaM2: number;
}

export interface CircuitCharge {
  readonly zoneKey: string;
  readonly liquidOdIn: number;
  readonly suctionOdIn: number;
  readonly liquidLabel: string;
  readonly suctionLabel: string;
  readonly lengthFt: number;
  readonly liftFt: number;
  readonly adderOzPerFt: number;
  /** 'equipment' = maker's adder; 'estimate' = liquid-full tube volume at 100 °F. */
  readonly adderSource: 'equipment' | 'estimate';
  readonly extraChargeOz: number;
  readonly warnings: readonly string[];
}

export interface RefrigerantPlan {
  readonly refrigerant: OutdoorUnit['refrigerant'];
  readonly safetyClass: string;
  readonly circuits: readonly CircuitCharge[];
  readonly totalLengthFt: number;
  readonly extraChargeOz: number;
  readonly factoryChargeOz: number;
  readonly totalChargeOz: number;
  readonly warnings: readonly string[];
  readonly notes: readonly string[];
  readonly cautions: readonly string[];
  readonly isEstimate: true;
}

/**
 * Refrigerant plan for one outdoor unit: per-circuit extra charge beyond the pre-charged
 * length with the maker's adder (else a labelled tube-volume estimate), totals, length and
 * lift limits, A2L room-area check. Charges in oz, rounded half-up to 0.1 oz per circuit;
 * the system extra is the sum of the rounded circuits.
 */
export function refrigerantPlan({
  outdoor,
  circuits,
}: {
  readonly outdoor: OutdoorUnit;
  readonly circuits: readonly CircuitToPlan[];
}): RefrigerantPlan {
  const totalLength = circuits.reduce((s, c) => s + c.circuit.lengthFt, 0);
  const warnings: string[] = [];
  const systemExtraRaw =
    outdoor.prechargeBasis === 'system-total' && outdoor.adderOzPerFt !== undefined
      ? extraChargeOz({
          lengthFt: totalLength,
          prechargedLengthFt: outdoor.prechargedLengthFt,
          ozPerFt: outdoor.adderOzPerFt,
        })
      : null;
  const planned = circuits.map(({ circuit, indoor }): CircuitCharge => {
    const liquidOdIn = circuit.liquidOdIn ?? indoor.liquidOdIn;
    const suctionOdIn = circuit.suctionOdIn ?? indoor.suctionOdIn;
    const adder =
      outdoor.adderOzPerFt ??
      liquidLineChargeOzPerFt({
        odIn: liquidOdIn,
        liquidDensityLbPerFt3: LIQUID_DENSITY_100F_LB_FT3[outdoor.refrigerant],
      });
    const raw =
      systemExtraRaw !== null && totalLength > 0
        ? systemExtraRaw * (circuit.lengthFt / totalLength)
        : extraChargeOz({ lengthFt: circuit.lengthFt, prechargedLengthFt: outdoor.prechargedLengthFt, ozPerFt: adder });
    const w: string[] = [];
    if (circuit.lengthFt > outdoor.maxLineLengthFt)
      w.push(
        `Line set for ${circuit.zoneKey} is ${circuit.lengthFt} ft; the maker allows at most ${outdoor.maxLineLengthFt} ft.`,
      );
    if (circuit.lengthFt < outdoor.minLineLengthFt)
      w.push(
        `Line set for ${circuit.zoneKey} is ${circuit.lengthFt} ft; the maker asks for at least ${outdoor.minLineLengthFt} ft.`,
      );
    if (circuit.liftFt > outdoor.maxLiftFt)
      w.push(`Lift for ${circuit.zoneKey} is ${circuit.liftFt} ft; the maker allows at most ${outdoor.maxLiftFt} ft.`);
    if (circuit.liftFt > circuit.lengthFt)
      w.push(`Lift for ${circuit.zoneKey} is more than its line-set length: check both.`);
    if (liquidOdIn !== indoor.liquidOdIn)
      w.push(
        `Liquid line for ${circuit.zoneKey} differs from the indoor unit's connection: check the maker's charge rule for a changed line size.`,
      );
    return {
      zoneKey: circuit.zoneKey,
      liquidOdIn,
      suctionOdIn,
      liquidLabel: tubeLabel({ odIn: liquidOdIn }),
      suctionLabel: tubeLabel({ odIn: suctionOdIn }),
      lengthFt: circuit.lengthFt,
      liftFt: circuit.liftFt,
      adderOzPerFt: roundHalfUp(adder, 3),
      adderSource: outdoor.adderOzPerFt === undefined ? 'estimate' : 'equipment',
      extraChargeOz: roundHalfUp(raw, 1),
      warnings: w,
    };
  });
  if (outdoor.maxTotalLineLengthFt !== undefined && totalLength > outdoor.maxTotalLineLengthFt) {
    warnings.push(
      `Total line-set length is ${totalLength} ft; the maker allows at most ${outdoor.maxTotalLineLengthFt} ft for this outdoor unit.`,
    );
  }
  const extra = roundHalfUp(
    planned.reduce((s, c) => s + c.extraChargeOz, 0),
    1,
  );
  const total = roundHalfUp(outdoor.factoryChargeOz + extra, 1);
  const notes: string[] = [];
  const cautions: string[] = [CAUTIONS.makerAndCode, CAUTIONS.refrigerant, CAUTIONS.pressureTest];
  if (planned.some((c) => c.adderSource === 'estimate'))
    notes.push(
      "Estimate: the equipment data has no charge adder, so the extra charge assumes a liquid-full line at 100 °F. Use the maker's figure when you have it.",
    );
  const info = REFRIGERANT_INFO[outdoor.refrigerant];
  if (isA2l({ refrigerant: outdoor.refrigerant }) && info.lflKgPerM3 !== null) {
    cautions.push(CAUTIONS.a2l);
    const chargeKg = gFromOz({ oz: total }) / 1000;
    const m1 = a2lM1Kg({ lflKgPerM3: info.lflKgPerM3 });
    notes.push(`${outdoor.refrigerant} is an A2L refrigerant (lower flammability).`);
    if (chargeKg > m1) {
      notes.push(
        `The total charge (${roundHalfUp(chargeKg, 2)} kg) is above ${roundHalfUp(m1, 2)} kg (6 m³ × LFL), so minimum room-area rules apply [IEC 60335-2-40:2018 Annex GG]; confirm with the maker's table and the edition adopted locally.`,
      );
      for (const { circuit, indoor, roomAreaM2 } of circuits) {
        const minArea = a2lMinRoomAreaM2({
          chargeKg,
          lflKgPerM3: info.lflKgPerM3,
          h0M: A2L_INSTALL_HEIGHT_M[indoor.unitType],
        });
        if (roomAreaM2 < minArea)
          warnings.push(
            `The room with the ${circuit.zoneKey} indoor unit (${roundHalfUp(roomAreaM2, 1)} m²) is smaller than the estimated minimum ${roundHalfUp(minArea, 1)} m² for this charge: check the maker's room-size rules or mitigation.`,
          );
      }
    }
  }
  return {
    refrigerant: outdoor.refrigerant,
    safetyClass: info.safetyClass,
    circuits: planned,
    totalLengthFt: totalLength,
    extraChargeOz: extra,
    factoryChargeOz: outdoor.factoryChargeOz,
    totalChargeOz: total,
    warnings: [...warnings, ...planned.flatMap((c) => c.warnings)],
    notes,
    cautions,
    isEstimate: true,
  };
}
