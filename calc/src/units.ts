import convert from 'convert-units';
import { num } from './errors';

/**
 * Canonical units: imperial (ft, ft², ft³, in, °F, Btu/h, CFM, oz, lb, psig).
 * Metric appears only at the edges through these helpers. convert-units has no Btu,
 * so the energy-rate factors are named constants here.
 */

/** Btu/h per watt: 3600 s/h ÷ 1055.05585262 J/Btu(IT). [PUB: SI/NIST definitions] */
export const BTUH_PER_W = 3.412141633;
/** Btu/h per ton of refrigeration, exact by definition. [PUB: SI/NIST definitions] */
export const BTUH_PER_TON = 12000;
/** Grains per pound. [PUB: definition, 1 grain = 1/7000 lb] */
export const GRAINS_PER_LB = 7000;
/** Standard atmosphere, psia. [PUB: SI/NIST definitions] */
export const STANDARD_ATM_PSIA = 14.696;
/** Ounces per pound. [PUB: definition] */
export const OZ_PER_LB = 16;

/*
 * Linear factors taken from convert-units once at load (its lookups are slow per call);
 * temperatures are affine and convert per call.
 */
const factor = (from: string, to: string): number => convert(1).from(from).to(to);
const FT_PER_M = factor('m', 'ft');
const IN_PER_CM = factor('cm', 'in');
const FT2_PER_M2 = factor('m2', 'ft2');
const G_PER_OZ = factor('oz', 'g');
const LPS_PER_CFM = factor('ft3/min', 'l/s');
const KPA_PER_PSI = factor('psi', 'kPa');
const PA_PER_TORR = factor('torr', 'Pa');

/** Watts → Btu/h (× 3.412141633). No rounding. */
export function btuhFromW({ w }: { readonly w: number }): number {
  return num(w) * BTUH_PER_W;
}
/** Btu/h → watts. No rounding. */
export function wFromBtuh({ btuh }: { readonly btuh: number }): number {
  return num(btuh) / BTUH_PER_W;
}
/** Btu/h → tons of refrigeration (÷ 12,000). No rounding. */
export function tonsFromBtuh({ btuh }: { readonly btuh: number }): number {
  return num(btuh) / BTUH_PER_TON;
}
/** Tons → Btu/h. No rounding. */
export function btuhFromTons({ tons }: { readonly tons: number }): number {
  return num(tons) * BTUH_PER_TON;
}

/** Metres → feet (convert-units). */
export function ftFromM({ m }: { readonly m: number }): number {
  return num(m) * FT_PER_M;
}
/** Feet → metres (convert-units). */
export function mFromFt({ ft }: { readonly ft: number }): number {
  return num(ft) / FT_PER_M;
}
/** Centimetres → inches (convert-units). */
export function inFromCm({ cm }: { readonly cm: number }): number {
  return num(cm) * IN_PER_CM;
}
/** Square metres → square feet (convert-units). */
export function ft2FromM2({ m2 }: { readonly m2: number }): number {
  return num(m2) * FT2_PER_M2;
}
/** Square feet → square metres (convert-units). */
export function m2FromFt2({ ft2 }: { readonly ft2: number }): number {
  return num(ft2) / FT2_PER_M2;
}
/** °C → °F, an absolute temperature (convert-units). */
export function fFromC({ c }: { readonly c: number }): number {
  return convert(num(c)).from('C').to('F');
}
/** °F → °C, an absolute temperature (convert-units). */
export function cFromF({ f }: { readonly f: number }): number {
  return convert(num(f)).from('F').to('C');
}
/** A temperature difference in °F → K (× 5/9, no offset: 20 °F difference = 11.11 K). */
export function kelvinDeltaFromF({ deltaF }: { readonly deltaF: number }): number {
  return (num(deltaF) * 5) / 9;
}
/** A temperature difference in K → °F (× 9/5). */
export function fDeltaFromKelvin({ deltaK }: { readonly deltaK: number }): number {
  return (num(deltaK) * 9) / 5;
}
/** Ounces → grams (convert-units). */
export function gFromOz({ oz }: { readonly oz: number }): number {
  return num(oz) * G_PER_OZ;
}
/** Grams → ounces (convert-units). */
export function ozFromG({ g }: { readonly g: number }): number {
  return num(g) / G_PER_OZ;
}
/** oz/ft → g/m (1 oz/ft = 93.010 g/m). */
export function gPerMFromOzPerFt({ ozPerFt }: { readonly ozPerFt: number }): number {
  return gFromOz({ oz: num(ozPerFt) }) / mFromFt({ ft: 1 });
}
/** g/m → oz/ft. */
export function ozPerFtFromGPerM({ gPerM }: { readonly gPerM: number }): number {
  return ozFromG({ g: num(gPerM) }) / ftFromM({ m: 1 });
}
/** CFM → L/s (convert-units ft3/min → l/s). */
export function lpsFromCfm({ cfm }: { readonly cfm: number }): number {
  return num(cfm) * LPS_PER_CFM;
}
/** L/s → CFM. */
export function cfmFromLps({ lps }: { readonly lps: number }): number {
  return num(lps) / LPS_PER_CFM;
}
/** psi → kPa (convert-units). */
export function kpaFromPsi({ psi }: { readonly psi: number }): number {
  return num(psi) * KPA_PER_PSI;
}
/** Microns of mercury (mTorr) → Pa (convert-units torr ÷ 1000). */
export function paFromMicrons({ microns }: { readonly microns: number }): number {
  return (num(microns) / 1000) * PA_PER_TORR;
}
