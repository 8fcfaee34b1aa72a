import { Text, View } from '@react-pdf/renderer';
import { CAUTIONS } from '@calc';
import type { SnapshotOption } from '@contract';
import { amps, feet, line, ounces, plain } from './format';
import { Pairs, Table } from './parts';
import { s } from './styles';

type System = SnapshotOption['systems'][number];
type LineSet = System['lineSets'][number];

function runCell(l: LineSet): string {
  const installed = l.installedLengthFt !== l.lengthFt ? `\n${feet(l.installedLengthFt)} installed` : '';
  const kind = l.kind === 'kit' ? 'pre-flared kit' : 'cut to length';
  return `${feet(l.lengthFt)} run${installed}\n${kind}${l.liftFt > 0 ? `, ${feet(l.liftFt)} lift` : ''}`;
}

const condensateCell = (l: LineSet) =>
  `${l.condensate.kind === 'pump' ? 'Condensate pump' : 'Gravity drain'}${l.condensate.lengthFt > 0 ? `, ${feet(l.condensate.lengthFt)} line` : ''}`;

function SystemScope({ sys, titled }: { sys: System; titled: boolean }) {
  const e = sys.electrical;
  return (
    <View>
      {titled ? <Text style={s.h3}>{line(sys.name)}</Text> : null}
      <Text style={[s.strong, { marginTop: 4 }]}>{`Refrigerant lines (${line(sys.refrigerant)})`}</Text>
      <Table
        columns={[
          { label: 'Indoor unit', flex: 3 },
          { label: 'Tubing (liquid / suction)', flex: 2.6 },
          { label: 'Length', flex: 2.6 },
          { label: 'Refrigerant added', flex: 2, numeric: true },
          { label: 'Drain', flex: 2.4 },
        ]}
        rows={sys.lineSets.map((l) => ({
          key: l.zoneKey,
          cells: [
            line(l.zoneName),
            `${line(l.liquid)} in / ${line(l.suction)} in`,
            runCell(l),
            ounces(l.extraChargeOz),
            condensateCell(l),
          ],
        }))}
      />
      {sys.lineSets.map((l) => (
        <Text key={l.zoneKey} style={[s.small, { marginBottom: 1.5 }]}>
          {`${line(l.zoneName)}, refrigerant added: ${line(l.extraChargeText)}`}
        </Text>
      ))}
      <Text style={[s.small, { marginTop: 2 }]}>
        {`Refrigerant added beyond the factory charge, all lines: ${ounces(sys.extraChargeOz)}; the system holds ${ounces(sys.totalChargeOz)} in all. The installer weighs in the final charge and records it.`}
      </Text>

      <View style={{ flexDirection: 'row', marginTop: 8 }} wrap={false}>
        <View style={{ flex: 3, paddingRight: 18 }}>
          <Text style={s.strong}>Electrical</Text>
          <Pairs
            labelFlex={5}
            valueFlex={2}
            pairs={[
              { label: 'Supply', value: `${plain(e.supplyVoltage)} V` },
              { label: 'Minimum circuit ampacity (nameplate)', value: amps(e.mcaA) },
              { label: 'Maximum overcurrent protection (nameplate)', value: amps(e.mocpA) },
              { label: 'Breaker', value: e.breakerA === null ? 'Set by the electrician' : amps(e.breakerA) },
              {
                label: 'Wire size (copper)',
                value: e.wireAwg === null ? 'Set by the electrician' : `${e.wireAwg} AWG`,
              },
              { label: 'Circuit length, panel to outdoor unit', value: feet(e.circuitLengthFt) },
              { label: 'Disconnect at the outdoor unit', value: amps(e.disconnectA) },
            ]}
          />
        </View>
        <View style={[s.note, { flex: 2, marginTop: 14 }]}>
          <Text style={s.strong}>For the licensed electrician</Text>
          <Text style={{ marginTop: 2 }}>{CAUTIONS.electrical}</Text>
        </View>
      </View>
    </View>
  );
}

/** The installation work of one option: refrigerant lines with their added charge and why, electrical, drains. */
export function ScopeSection({ option }: { option: SnapshotOption }) {
  return (
    <View>
      <Text style={s.h2}>Installation work</Text>
      {option.systems.map((sys) => (
        <SystemScope key={sys.key} sys={sys} titled={option.systems.length > 1} />
      ))}
    </View>
  );
}
