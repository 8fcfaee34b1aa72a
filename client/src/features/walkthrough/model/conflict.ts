import { asNumber, asRecord, asRecords, asString } from './draft';

/** The walk-through's field names and how its values read side by side (lib/offline/conflict.ts compares). */
export const ROOM_FIELD_LABELS: Record<string, string> = {
  name: 'Room name',
  floorLevel: 'Floor level',
  lengthFt: 'Length (ft)',
  widthFt: 'Width (ft)',
  areaFt2: 'Floor area (ft²)',
  ceilingHeightFt: 'Ceiling height (ft)',
  exposedWalls: 'Outside walls',
  above: 'Above the room',
  below: 'Below the room',
  occupants: 'Occupants',
  appliances: 'Appliances',
  achOverride: 'Air changes per hour',
  notes: 'Notes',
};

export const JOB_FIELD_LABELS: Record<string, string> = {
  outdoorCoolingDryBulbF: 'Outdoor cooling dry bulb (°F)',
  outdoorCoolingWetBulbF: 'Outdoor coincident wet bulb (°F)',
  outdoorCoolingGrains: 'Outdoor humidity (grains/lb)',
  outdoorHeatingDryBulbF: 'Outdoor heating dry bulb (°F)',
  indoorCoolingF: 'Indoor cooling set point (°F)',
  indoorHeatingF: 'Indoor heating set point (°F)',
  indoorCoolingRhPercent: 'Indoor relative humidity (%)',
  dailyRangeF: 'Daily temperature range (°F)',
  elevationFt: 'Elevation (ft)',
  source: 'Source of the design values',
};

/** A short plain description of a value for the side-by-side view. */
export function describe(key: string, v: unknown): string {
  if (v === undefined || v === null || v === '') return '—';
  if (key === 'exposedWalls') {
    const walls = asRecords(v);
    if (walls.length === 0) return 'No outside walls';
    return walls
      .map(
        (w) =>
          `${asString(w.direction)} ${asNumber(w.lengthFt) ?? '?'} ft, ${asRecords(w.windows).length} window(s), ${asRecords(w.doors).length} door(s)`,
      )
      .join('; ');
  }
  if (key === 'appliances') {
    const list = asRecords(v);
    return list.length === 0
      ? 'None'
      : list.map((a) => `${asString(a.label)} ${asNumber(a.gain) ?? '?'} ${asString(a.unit, 'W')}`).join('; ');
  }
  if (key === 'above' || key === 'below') {
    const r = asRecord(v);
    return [asString(r.kind), asString(r.insulation)].filter(Boolean).join(', ');
  }
  return typeof v === 'string' || typeof v === 'number' || typeof v === 'boolean' ? String(v) : JSON.stringify(v);
}
