/**
 * An invented job's design conditions and site, for the server tests (through jobs-helpers.ts) and the
 * desk bench: plain data, no test runner, so bench/ imports it too.
 */
export const DESIGN = {
  outdoorCoolingDryBulbF: 94,
  outdoorCoolingWetBulbF: 75,
  outdoorHeatingDryBulbF: 15,
  indoorCoolingF: 75,
  indoorHeatingF: 70,
  indoorCoolingRhPercent: 50,
  dailyRangeF: 22,
  elevationFt: 800,
};

export const SITE = { street: '12 Fennimore Lane', city: 'Quillmere', region: 'Demo State', postalCode: '00042' };
