import { Text, View } from '@react-pdf/renderer';
import type { ProposalSnapshot } from '@contract';
import { btuh, hourOfDay, line, paragraphs, plain, squareFeet } from './format';
import { Table } from './parts';
import { s } from './styles';

/** The design conditions a homeowner can read, in the walk-through's words, with their units. */
const CONDITIONS: readonly { key: string; label: string; unit: (v: number) => string }[] = [
  { key: 'outdoorCoolingDryBulbF', label: 'Outdoor temperature, cooling design', unit: (v) => `${plain(v)} °F` },
  { key: 'outdoorCoolingWetBulbF', label: 'Outdoor coincident wet bulb', unit: (v) => `${plain(v)} °F` },
  { key: 'outdoorCoolingGrains', label: 'Outdoor humidity', unit: (v) => `${plain(v)} grains/lb` },
  { key: 'outdoorHeatingDryBulbF', label: 'Outdoor temperature, heating design', unit: (v) => `${plain(v)} °F` },
  { key: 'indoorCoolingF', label: 'Indoor temperature, cooling', unit: (v) => `${plain(v)} °F` },
  { key: 'indoorHeatingF', label: 'Indoor temperature, heating', unit: (v) => `${plain(v)} °F` },
  { key: 'indoorCoolingRhPercent', label: 'Indoor relative humidity, cooling', unit: (v) => `${plain(v)} %` },
  { key: 'dailyRangeF', label: 'Daily temperature range', unit: (v) => `${plain(v)} °F` },
  { key: 'elevationFt', label: 'Elevation', unit: (v) => `${plain(v)} ft` },
  { key: 'latitudeDeg', label: 'Latitude', unit: (v) => `${plain(Math.abs(v))}° ${v < 0 ? 'S' : 'N'}` },
];

/** A condition's source as the snapshot holds it: a sentence, or `{ source, note }`. */
function sourceText(raw: unknown, fallback: string): string {
  if (typeof raw === 'string' && raw.trim() !== '') return line(raw);
  if (typeof raw === 'object' && raw !== null) {
    const note = 'note' in raw && typeof raw.note === 'string' ? raw.note.trim() : '';
    if (note !== '') return line(note);
    const source = 'source' in raw && typeof raw.source === 'string' ? raw.source : '';
    if (source === 'entered') return 'Entered for this home';
    if (source === 'company-default') return 'The company’s standard for the area';
    if (source === 'standard-default') return 'A general default';
  }
  return fallback;
}

/**
 * The home's loads: the method statement first (how the figures were made, and that they are an estimate),
 * the design conditions with where each came from, then each room and the whole home at its peak hour.
 */
export function LoadsSection({ snapshot }: { snapshot: ProposalSnapshot }) {
  const { design, loads } = snapshot;
  const generalSource =
    typeof design.sources.source === 'string' && design.sources.source.trim() !== ''
      ? line(design.sources.source)
      : '—';
  const conditions = CONDITIONS.flatMap((c) => {
    const v = design.conditions[c.key];
    return typeof v === 'number' && Number.isFinite(v)
      ? [{ key: c.key, cells: [c.label, c.unit(v), sourceText(design.sources[c.key], generalSource)] }]
      : [];
  });
  const b = loads.block;
  return (
    <View>
      <Text style={s.h1}>Your home’s heating and cooling loads</Text>
      <Text style={s.lead}>
        How much heat each room gains on a hot day and loses on a cold one: the figures the equipment in each option was
        chosen to meet.
      </Text>
      <View style={s.note} wrap={false}>
        <Text style={s.strong}>These loads are an estimate.</Text>
        {paragraphs(design.method).map((p, i) => (
          <Text key={i} style={{ marginTop: 3 }}>
            {p}
          </Text>
        ))}
      </View>

      <Text style={s.h2}>Design conditions</Text>
      <Table
        columns={[
          { label: 'Condition', flex: 4 },
          { label: 'Value', flex: 2, numeric: true },
          { label: 'Source', flex: 5 },
        ]}
        rows={conditions}
      />

      <Text style={s.h2}>Room by room</Text>
      <Table
        columns={[
          { label: 'Room', flex: 4 },
          { label: 'Floor area', flex: 2, numeric: true },
          { label: 'Cooling, sensible', flex: 2.4, numeric: true },
          { label: 'Cooling, latent', flex: 2.2, numeric: true },
          { label: 'Cooling, total', flex: 2.4, numeric: true },
          { label: 'Heating', flex: 2.4, numeric: true },
        ]}
        rows={[
          ...loads.rooms.map((r) => ({
            key: r.roomId,
            cells: [
              line(r.name),
              squareFeet(r.floorAreaFt2),
              btuh(r.sensibleBtuh),
              btuh(r.latentBtuh),
              btuh(r.coolingBtuh),
              btuh(r.heatingBtuh),
            ],
          })),
          {
            key: 'block',
            total: true,
            cells: [
              `Whole home at ${hourOfDay(b.hour)}`,
              squareFeet(b.floorAreaFt2),
              btuh(b.sensibleBtuh),
              btuh(b.latentBtuh),
              btuh(b.coolingBtuh),
              btuh(b.heatingBtuh),
            ],
          },
        ]}
      />
      <Text style={[s.small, { marginTop: 4 }]}>
        Each room’s cooling figure is at its own hottest hour. The whole-home figure is taken at the single hour (solar
        time) when all rooms together need the most cooling, so it is less than the rooms added up: rooms facing
        different ways peak at different times. Btu/h: British thermal units per hour.
      </Text>
    </View>
  );
}
