import { LATENT_CONSTANT, SENSIBLE_CONSTANT } from '../air';
import { PERSON_LATENT_W, PERSON_SENSIBLE_W } from '../construction-defaults';
import { BTUH_PER_W } from '../units';
import type { Room } from '../schemas/room-input';
import type { DesignPsychrometrics } from './conditions';
import { floorAreaFt2 } from '../geometry';

/** Air leakage of a room: CFM and its sensible/latent gain and heat loss, Btu/h, unrounded. */
export interface InfiltrationLoad {
  readonly cfm: number;
  readonly ach: number;
  readonly sensibleCooling: number;
  readonly latentCooling: number;
  readonly heating: number;
}

/**
 * Air-change infiltration (CFM = ACH × V / 60), sensible 1.08 × CFM × ΔT and latent
 * 0.68 × CFM × Δgr, both × the altitude factor. [PUB: air-change method; §1 constants;
 * MEM: ASHRAE ch. 17 altitude factor] ACH from the room override or the home's tightness.
 */
export function infiltrationLoad(room: Room, p: DesignPsychrometrics, homeAch: number): InfiltrationLoad {
  const ach = room.achOverride ?? homeAch;
  const cfm = (ach * floorAreaFt2(room) * room.ceilingHeightFt) / 60;
  const af = p.altitudeFactor;
  return {
    cfm,
    ach,
    // sensibleHeatBtuh / latentHeatBtuh written out (cfm ≥ 0 here), so no argument objects per room
    sensibleCooling: Math.max(0, SENSIBLE_CONSTANT * cfm * p.coolingDeltaTF * af),
    latentCooling: LATENT_CONSTANT * cfm * p.deltaGrains * af,
    heating: SENSIBLE_CONSTANT * cfm * p.heatingDeltaTF * af,
  };
}

/** People: occupants × 70 W sensible / 45 W latent (× 3.412 Btu/h per W). [PUB: ASHRAE ch. 18 Table 1] Cooling only. */
export function peopleLoad(room: Room): { sensible: number; latent: number } {
  return {
    sensible: room.occupants * PERSON_SENSIBLE_W * BTUH_PER_W,
    latent: room.occupants * PERSON_LATENT_W * BTUH_PER_W,
  };
}

/** Appliances and lights: W × 3.412 or Btu/h as entered, plus entered latent. [PUB: unit definition] Cooling only. */
export function appliancesLoad(room: Room): { sensible: number; latent: number } {
  let sensible = 0;
  let latent = 0;
  for (const a of room.appliances) {
    sensible += a.unit === 'W' ? a.gain * BTUH_PER_W : a.gain;
    latent += a.latentBtuh;
  }
  return { sensible, latent };
}
