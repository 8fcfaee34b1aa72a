/**
 * Takeoff and labor defaults [TRADE — common practice; each company edits its own].
 * Lengths in ft, hours in h, cylinder sizes in lb.
 */
export const TAKEOFF_DEFAULTS = {
  /** Pre-insulated line-set kit lengths sold. */
  lineSetKitLengthsFt: [15, 25, 35, 50, 75, 100],
  /** Line-cover straight section length. */
  lineCoverPieceFt: 8,
  /** Condensate line sold by 10 ft. */
  condensateStepFt: 10,
  /** Communication cable: slack added, then rounded up to 5 ft. Branch-circuit wire and cable too are sold by 5 ft here. */
  cableSlackFt: 5,
  cableStepFt: 5,
  /**
   * Branch-circuit wire and cable: each conductor (or cable) is the run plus this much at each of its two
   * ends for the termination (panel, disconnect or unit), then waste on the total. [common practice;
   * NEC 300.14 asks at least 6 in of free conductor at each box — from memory — and a termination
   * at a panel or disconnect takes more]
   */
  terminationAllowanceFtPerEnd: 1.5,
  wireWastePercent: 10,
  /** EMT is sold in 10 ft lengths [common practice]. */
  emtStickFt: 10,
  /** Refrigerant sold in cylinders of this many lb. */
  cylinderLb: { 'R-410A': 25, 'R-32': 20, 'R-454B': 20 },
} as const;

/** Labor table, hours per task. [TRADE; the company's own table overrides] */
export const LABOR_HOURS = {
  mountWallHead: 1.5,
  mountCassette: 3,
  mountFloorConsole: 1.5,
  /** Hang a slim ducted head and connect its duct collars: as an air handler's setting [TRADE, from memory]. */
  mountSlimDucted: 4,
  mountAirHandler: 4,
  setOutdoorPad: 1,
  setOutdoorBracket: 2,
  lineSetBase: 0.75,
  lineSetPerFt: 0.02,
  wallPenetration: 0.5,
  condensateGravity: 0.5,
  condensatePump: 1.5,
  lineCoverPerFt: 0.05,
  electricalBase: 2,
  electricalPerFt: 0.02,
  pressureTestEvacuate: 2,
  chargeStartupBase: 1,
  chargeStartupPerCircuit: 0.25,
} as const;

/** One entry of the labor table: the hours the takeoff counts per unit of work. */
export type LaborHoursKey = keyof typeof LABOR_HOURS;

/**
 * The labor table a takeoff is counted with: hours per entry, and where each came from when it is not
 * the default table (the price book's labor task, by its description), for the line's derivation.
 */
export interface LaborTable {
  readonly hours: { readonly [K in LaborHoursKey]: number };
  readonly from: { readonly [K in LaborHoursKey]?: string };
}

/** The default table, named as such in every labor line's derivation. */
export const DEFAULT_LABOR_TABLE: LaborTable = { hours: LABOR_HOURS, from: {} };
