/**
 * Gaugeline calc — the pure trade engine (imported as `@calc`). No I/O, no clock, no
 * randomness. Canonical units imperial; see calc/README.md for the map.
 */
export * from './src/errors';
export * from './src/rounding';
export * from './src/units';
export * from './src/psychrometrics';
export * from './src/air';
export * from './src/conduction';
export * from './src/construction-defaults';
export * from './src/geometry';
export * from './src/parse';
export * from './src/metric';
export * from './src/tape';
export * from './src/solar/design-day';

export * from './src/schemas/fields';
export * from './src/schemas/design-conditions';
export * from './src/schemas/room';
export * from './src/schemas/room-input';
export * from './src/schemas/home';
export * from './src/schemas/equipment';
export * from './src/schemas/design';
export * from './src/schemas/ducts';

export * from './src/loads/conditions';
export * from './src/loads/hourly-method';
export * from './src/loads/design-day-context';
export * from './src/loads/envelope';
export * from './src/loads/internal';
export * from './src/loads/infiltration';
export * from './src/loads/notes';
export * from './src/loads/room-load';
export * from './src/loads/home-load';
export * from './src/loads/live-home';
export * from './src/loads/warnings';
export * from './src/loads/ducts';
export * from './src/loads/peak-detail';
export * from './src/loads/below-grade';

export * from './src/sizing/policy';
export * from './src/sizing/capacity';
export * from './src/sizing/match';

export * from './src/refrigerant/tube';
export * from './src/refrigerant/charge';
export * from './src/refrigerant/a2l';
export * from './src/refrigerant/cautions';
export * from './src/refrigerant/circuits';

export * from './src/electrical/nec';
export * from './src/electrical/raceway';
export * from './src/electrical/plan';
export * from './src/electrical/disconnect-run';
export * from './src/commissioning/checks';
export * from './src/commissioning/record';

export * from './src/takeoff/defaults';
export * from './src/takeoff/lines';
export * from './src/takeoff/build';

export * from './src/pricing/money';
export * from './src/pricing/schemas';
export * from './src/pricing/price';

export * from './src/design/zone-loads';
export * from './src/design/compute-design';
export * from './src/design/design-ducts';
export * from './src/design/options';

export * from './src/catalog/sell-rule';
export * from './src/catalog/model';
export * from './src/catalog/model-queries';
export * from './src/catalog/price-book';
export * from './src/catalog/csv-columns';
export * from './src/catalog/csv-safety';
export * from './src/catalog/datasets';
export * from './src/catalog/records';
export * from './src/catalog/diff-import';
export * from './src/catalog/metric-columns';

export * from './src/contract-law/cooling-off';

export * from './src/explain/format';
export * from './src/explain/explanation';
export * from './src/pricing/discount';
export * from './src/pricing/preliminary';
export * from './src/pricing/explain-price';
export * from './src/takeoff/regenerate';
export * from './src/refrigerant/rules';
export * from './src/electrical/voltage-drop';
export * from './src/sizing/ports';
export * from './src/design/explain-sizing';
export * from './src/catalog/design-bridge';
export * from './src/design/suggest';
export * from './src/design/first-price';
