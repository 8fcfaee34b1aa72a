/**
 * Caution texts shown wherever calc output guides refrigerant, pressure or electrical
 * work. Our own wording (based on the project's caution set C1–C7); stable keys so a
 * proposal version can store which texts it showed.
 */
export const CAUTIONS = {
  estimate:
    'These figures are estimates from the inputs shown. Qualified staff confirm sizes and quantities on site before work begins.',
  makerAndCode:
    "Follow the equipment maker's installation instructions and the codes adopted where the home is; where they differ from these figures, they govern.",
  refrigerant:
    'Only technicians holding the EPA Section 608 certification the law requires may recover, charge or repair refrigerant circuits. Venting refrigerant is illegal.',
  a2l: "This system uses an A2L (lower-flammability) refrigerant: use A2L-rated tools and leak detectors, keep ignition sources away, and follow the maker's room-size and ventilation rules.",
  pressureTest:
    'Pressure-test only with dry nitrogen through a regulator with a relief valve — never oxygen, compressed air or a flammable gas — and never above the lowest rated test pressure of any part under test.',
  electrical:
    'Wire, breaker and disconnect sizes are estimates from the nameplate MCA and MOCP. A licensed electrician confirms them against the nameplate and the adopted electrical code.',
  homeowner: 'Homeowners should not install, charge or service refrigerant or high-voltage parts themselves.',
} as const;

export type CautionKey = keyof typeof CAUTIONS;
