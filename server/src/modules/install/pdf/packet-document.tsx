import { Document, Page, Text, View, StyleSheet } from '@react-pdf/renderer';
import type { InstallPacket, PacketSystem } from '@contract';
import { FONT_WEIGHTS } from '../../proposals/pdf/fonts';
import { amps, btuh, day, feet, line, ounces, paragraphs, plain } from '../../proposals/pdf/format';
import { Bullets, Pairs, Table } from '../../proposals/pdf/parts';
import { COLORS, s } from '../../proposals/pdf/styles';

/**
 * The installer's job packet as a PDF (issue 15): our own layout for the van and the site — the sold
 * equipment and where each indoor unit goes, every line-set run with the charge to weigh in and calc's
 * working, the electrical and condensate, the material list (no prices), and the cautions first and
 * beside the figures they guard. US Letter, the proposal's typeface. Every string goes through `line`.
 */

const k = StyleSheet.create({
  band: {
    backgroundColor: COLORS.ink,
    color: '#ffffff',
    paddingVertical: 5,
    paddingHorizontal: 8,
    marginTop: 14,
    marginBottom: 6,
    fontSize: 12,
    fontWeight: FONT_WEIGHTS.bold,
  },
  title: { fontSize: 20, fontWeight: FONT_WEIGHTS.bold, color: COLORS.ink, lineHeight: 1.2 },
  where: { flexDirection: 'row', gap: 12, marginTop: 6 },
  whereCol: { flex: 1 },
  unit: { borderWidth: 0.75, borderColor: COLORS.inkLine, padding: 7, marginBottom: 6 },
  unitTitle: { fontWeight: FONT_WEIGHTS.semibold, color: COLORS.ink, fontSize: 11 },
  formula: { fontSize: 9.5, color: COLORS.text, marginTop: 2 },
  chargeBox: {
    borderWidth: 1.5,
    borderColor: COLORS.ink,
    padding: 8,
    marginVertical: 6,
    flexDirection: 'row',
    justifyContent: 'space-between',
  },
  chargeFigure: { fontSize: 15, fontWeight: FONT_WEIGHTS.bold, color: COLORS.ink },
  tick: { width: 9, height: 9, borderWidth: 0.9, borderColor: COLORS.ink, marginRight: 6, marginTop: 2 },
  tickRow: { flexDirection: 'row', marginBottom: 3 },
});

const dim = (m: { nominalCoolingBtuh: number | null; nominalHeatingBtuh: number | null }) =>
  [
    m.nominalCoolingBtuh === null ? null : `cooling ${btuh(m.nominalCoolingBtuh)}`,
    m.nominalHeatingBtuh === null ? null : `heating ${btuh(m.nominalHeatingBtuh)}`,
  ]
    .filter(Boolean)
    .join(', ');

function Caution({ c }: { c: InstallPacket['cautions'][number] }) {
  return (
    <View style={s.caution} wrap={false}>
      <Text style={s.cautionTitle}>{line(c.title)}</Text>
      <Text>{line(c.text)}</Text>
    </View>
  );
}

function SystemPages({ system, n, packet }: { system: PacketSystem; n: number; packet: InstallPacket }) {
  const caution = (key: InstallPacket['cautions'][number]['key']) => {
    const c = packet.cautions.find((x) => x.key === key);
    return c ? <Caution c={c} /> : null;
  };
  const e = system.electrical;
  return (
    <View break={n > 0}>
      <Text style={k.band}>{line(`System ${n + 1}: ${system.name}`)}</Text>
      <Pairs
        pairs={[
          { label: 'Outdoor unit', value: line(`${system.outdoor.model} (${system.outdoor.name})`) },
          { label: 'Capacity (nominal)', value: dim(system.outdoor) || '—' },
          { label: 'Refrigerant', value: line(system.a2l ? `${system.refrigerant} (A2L)` : system.refrigerant) },
          ...(system.heatKit
            ? [{ label: 'Heat kit', value: line(`${system.heatKit.model} (${system.heatKit.name})`) }]
            : []),
        ]}
        labelFlex={2}
        valueFlex={3}
      />
      {system.a2l ? caution('a2l') : null}

      <Text style={s.h2}>Where each indoor unit goes</Text>
      {system.indoorUnits.map((u) => (
        <View key={u.zoneName} style={k.unit} wrap={false}>
          <Text style={k.unitTitle}>{line(`${u.zoneName}: ${u.unit.model}`)}</Text>
          <Text style={s.small}>{line(`${u.unit.name}, ${u.unit.kind}; ${dim(u.unit)}`)}</Text>
          {u.rooms.map((r) => (
            <View key={r.name} style={{ marginTop: 4 }}>
              <Text style={s.strong}>
                {line(
                  `Room: ${r.name}${r.photos.length ? ` (${r.photos.length} photo${r.photos.length === 1 ? '' : 's'} in the app)` : ''}`,
                )}
              </Text>
              {paragraphs(r.notes).map((p, i) => (
                <Text key={i}>{p}</Text>
              ))}
              {r.roomId === null ? <Text style={s.small}>This room is no longer on the job in the app.</Text> : null}
            </View>
          ))}
        </View>
      ))}

      <Text style={s.h2}>Line sets and the charge to weigh in</Text>
      {caution('refrigerant')}
      <Table
        columns={[
          { label: 'Circuit', flex: 3 },
          { label: 'Liquid / suction', flex: 2.4 },
          { label: 'Planned run', flex: 1.7, numeric: true },
          { label: 'Counted', flex: 1.6, numeric: true },
          { label: 'Lift', flex: 1.2, numeric: true },
          { label: 'Add', flex: 1.4, numeric: true },
        ]}
        rows={system.lineSets.map((l, i) => ({
          key: `${i}`,
          cells: [
            line(`${l.zoneName} (${l.kind === 'kit' ? 'kit' : 'field-cut'})`),
            line(`${l.liquid} in / ${l.suction} in`),
            feet(l.plannedLengthFt),
            feet(l.installedLengthFt),
            feet(l.liftFt),
            ounces(l.extraChargeOz),
          ],
        }))}
      />
      {system.lineSets.map((l, i) => (
        <Text key={i} style={k.formula}>
          {line(`${l.zoneName}: ${l.extraChargeText}`)}
        </Text>
      ))}
      <View style={k.chargeBox} wrap={false}>
        <View>
          <Text style={s.small}>Extra charge to weigh in, this system</Text>
          <Text style={k.chargeFigure}>{ounces(system.extraChargeOz)}</Text>
        </View>
        <View>
          <Text style={s.small}>Total system charge (factory + extra)</Text>
          <Text style={k.chargeFigure}>{ounces(system.totalChargeOz)}</Text>
        </View>
      </View>
      {caution('pressureTest')}

      <Text style={s.h2}>Electrical</Text>
      <Pairs
        pairs={[
          { label: 'Supply', value: `${plain(e.supplyVoltage)} V` },
          { label: 'Minimum circuit ampacity (MCA)', value: amps(e.mcaA) },
          { label: 'Maximum overcurrent protection (MOCP)', value: amps(e.mocpA) },
          { label: 'Breaker', value: e.breakerA === null ? 'Per the nameplate' : amps(e.breakerA) },
          { label: 'Conductors', value: e.wireAwg === null ? 'Per the nameplate' : `${plain(e.wireAwg)} AWG copper` },
          { label: 'Circuit length', value: feet(e.circuitLengthFt) },
          { label: 'Disconnect', value: amps(e.disconnectA) },
        ]}
      />
      {caution('electrical')}

      <Text style={s.h2}>Condensate</Text>
      <Bullets
        items={system.lineSets.map((l) =>
          line(
            `${l.zoneName}: ${l.condensate.kind === 'pump' ? 'condensate pump' : 'gravity drain'}, about ${feet(l.condensate.lengthFt)} of drain line`,
          ),
        )}
      />
    </View>
  );
}

export function PacketDocument({ packet }: { packet: InstallPacket }) {
  const site = [
    packet.site.street,
    packet.site.unit,
    `${packet.site.city}, ${packet.site.region} ${packet.site.postalCode}`,
  ]
    .filter((x) => x.trim() !== '')
    .join(', ');
  const head = line(`${packet.company.name} · Job packet`);
  return (
    <Document title={line(`Job packet — ${packet.customer.name}`)} author={line(packet.company.name)}>
      <Page size="LETTER" style={s.page}>
        <View style={s.header} fixed>
          <Text>{head}</Text>
          <Text>{line(site)}</Text>
        </View>
        <Text style={k.title}>Job packet</Text>
        <Text style={s.lead}>
          {line(
            `${packet.sold.optionName}, as signed ${day(packet.sold.signedAt)} (proposal version ${packet.sold.versionNumber})`,
          )}
        </Text>
        <View style={k.where}>
          <View style={k.whereCol}>
            <Text style={s.th}>Site</Text>
            <Text style={s.strong}>{line(site)}</Text>
          </View>
          <View style={k.whereCol}>
            <Text style={s.th}>Customer</Text>
            <Text style={s.strong}>{line(packet.customer.name)}</Text>
            {packet.customer.phone ? <Text>{line(packet.customer.phone)}</Text> : null}
          </View>
          <View style={k.whereCol}>
            <Text style={s.th}>Office</Text>
            <Text style={s.strong}>{line(packet.company.name)}</Text>
            {packet.company.phone ? <Text>{line(packet.company.phone)}</Text> : null}
          </View>
        </View>
        {packet.jobNotes.trim() ? (
          <View style={s.note}>
            <Text style={s.strong}>Notes from the walk-through</Text>
            {paragraphs(packet.jobNotes).map((p, i) => (
              <Text key={i}>{p}</Text>
            ))}
          </View>
        ) : null}
        <View style={k.chargeBox} wrap={false}>
          <View>
            <Text style={s.small}>Extra charge to weigh in, all systems</Text>
            <Text style={k.chargeFigure}>{ounces(packet.extraChargeOz)}</Text>
          </View>
          <View>
            <Text style={s.small}>Total charge, all systems</Text>
            <Text style={k.chargeFigure}>{ounces(packet.totalChargeOz)}</Text>
          </View>
        </View>
        <Text style={s.h2}>Before you start</Text>
        {packet.cautions.map((c) => (
          <Caution key={c.key} c={c} />
        ))}
        {packet.systems.map((sys, i) => (
          <SystemPages key={i} system={sys} n={i} packet={packet} />
        ))}
        <View break>
          <Text style={k.band}>Material list</Text>
          <Text style={s.small}>Quantities as sold; check them against the site before loading the van.</Text>
          {packet.materials.length === 0 ? (
            <Text style={s.p}>The sold option lists no materials.</Text>
          ) : (
            packet.materials.map((m, i) => (
              <View key={i} style={k.tickRow} wrap={false}>
                <View style={k.tick} />
                <Text style={{ flex: 1 }}>{line(`${plain(m.quantity)} ${m.unit}  ${m.description}`)}</Text>
              </View>
            ))
          )}
        </View>
        <View style={s.footer} fixed>
          <Text>{line(packet.customer.name)}</Text>
          <Text render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`} />
        </View>
      </Page>
    </Document>
  );
}
